import Link from "next/link";
import { Notice } from "@/components/ui/notice";
import type { RegisterOutcome } from "@/lib/compounds/actions";
import type { RecordProblem } from "@/lib/compounds/import-records";

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

export function RegisterReport({ outcome }: { outcome: RegisterOutcome }) {
  if (outcome.status === "rejected") {
    return (
      <Notice tone="error" title={outcome.message}>
        <ProblemList problems={outcome.problems} />
      </Notice>
    );
  }
  return (
    <div className="space-y-3">
      <Notice tone="success" title={outcome.created.length === 0 ? "Nothing new to register." : `Registered ${plural(outcome.created.length, "compound")}.`}>
        {outcome.created.length > 0 ? (
          <ul className="mt-1 space-y-0.5" aria-label="Registered compounds">
            {outcome.created.map((c) => (
              <li key={c.id}>
                <Link href={`/compounds/${c.id}`} className="font-medium underline">{c.name}</Link>{" "}
                <span className="text-xs">({c.label}; {plural(c.siteCount, "ionizable site")} estimated)</span>
              </li>
            ))}
          </ul>
        ) : null}
      </Notice>
      {outcome.skipped.length > 0 ? (
        <Notice tone="warning" title={`Left out ${plural(outcome.skipped.length, "duplicate")}.`}>
          <ProblemList problems={outcome.skipped} />
        </Notice>
      ) : null}
    </div>
  );
}

function ProblemList({ problems }: { problems: RecordProblem[] }) {
  return (
    <ul className="mt-1 list-disc space-y-1 pl-5" aria-label="Records that need attention">
      {problems.map((p) => (
        <li key={`${p.line}-${p.code}-${p.record ?? 0}`} data-code={p.code}>
          {p.message}
          {p.duplicateOf?.id ? (
            <>
              {" "}
              <Link href={`/compounds/${p.duplicateOf.id}`} className="underline">Open “{p.duplicateOf.name}”</Link>
            </>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
