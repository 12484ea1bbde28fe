// Client ids for list items (components, steps, mixture rows, pKa rows). Never saved: only React keys and the
// mapping of validation messages to the right row.
let counter = 0;

export function newClientId(prefix = "r"): string {
  counter += 1;
  return `${prefix}${counter.toString(36)}${Math.random().toString(36).slice(2, 6)}`;
}
