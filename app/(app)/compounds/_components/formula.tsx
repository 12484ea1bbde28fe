/** A Hill formula with its counts as subscripts (C14H22N2O → C₁₄H₂₂N₂O). */
export function Formula({ formula }: { formula: string }) {
  const parts = formula.split(/(\d+)/).filter(Boolean);
  return (
    <span aria-label={formula}>
      {parts.map((part, i) => (/^\d+$/.test(part) ? <sub key={i}>{part}</sub> : <span key={i}>{part}</span>))}
    </span>
  );
}
