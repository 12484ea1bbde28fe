/**
 * The group's values for the editor's linked compounds (pooled log K by solvent, registry log P and pKa sites), fetched
 * from the server once per set of links, for the live prediction to lay over the spec as a save does. Until the first
 * answer, and when it fails, the preview runs on the spec alone.
 */
import { useEffect, useState } from "react";
import { type GroupValues } from "@/lib/partition/overlay";
import { groupValuesAction } from "@/lib/workups/actions";

const NONE: GroupValues = {};

export function useGroupValues(links: readonly { key: string; compoundId: string | null }[]): GroupValues {
  const linked = links.filter((l): l is { key: string; compoundId: string } => l.compoundId !== null);
  const linkKey = JSON.stringify(linked.map((l) => [l.key, l.compoundId]).sort());
  const [fetched, setFetched] = useState<{ linkKey: string; values: GroupValues } | null>(null);

  useEffect(() => {
    const pairs = JSON.parse(linkKey) as [string, string][];
    if (pairs.length === 0) return;
    let current = true;
    groupValuesAction(pairs.map(([key, compoundId]) => ({ key, compoundId })))
      .then((result) => {
        if (current) setFetched({ linkKey, values: result.ok ? result.data : NONE });
      })
      .catch(() => {
        if (current) setFetched({ linkKey, values: NONE });
      });
    return () => {
      current = false;
    };
  }, [linkKey]);

  if (linkKey === "[]") return NONE;
  return fetched?.linkKey === linkKey ? fetched.values : NONE;
}
