"use client";
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { Field, FieldErrors, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ErrorSummary } from "@/components/ui/error-summary";
import type { RegisterOutcome } from "@/lib/compounds/actions";
import { type RegisterFormat } from "@/lib/compounds/schemas";
import { RegisterReport } from "./register-report";
import { sendRegistration } from "./register-request";

type Source = "paste" | "file";

const SMILES_EXAMPLE = "CC(=O)Oc1ccccc1C(=O)O aspirin\nCN1CCN(CC1)c1ccccc1 1-methyl-4-phenylpiperazine";

function formatOfFile(name: string): RegisterFormat {
  return /\.mol$/i.test(name) ? "mol" : "sdf";
}

export function RegisterForm() {
  const [source, setSource] = useState<Source>("paste");
  const [text, setText] = useState("");
  const [file, setFile] = useState<File | null>(null);
  const [tags, setTags] = useState("");
  const [skipDuplicates, setSkipDuplicates] = useState(false);
  const [outcome, setOutcome] = useState<RegisterOutcome | null>(null);
  const [failure, setFailure] = useState<{ message: string; fields?: Record<string, string[]> } | null>(null);
  const [pending, startTransition] = useTransition();

  function submit(onDuplicate: "reject" | "skip") {
    startTransition(async () => {
      setFailure(null);
      const body = source === "file" && file ? { format: formatOfFile(file.name), text: await file.text() } : { format: "smiles" as const, text };
      const result = await sendRegistration({ ...body, tags, onDuplicate });
      if (result.ok) {
        setOutcome(result.data);
        if (result.data.status === "registered") {
          setText("");
          setFile(null);
        }
      } else {
        setOutcome(null);
        setFailure({ message: result.message, fields: result.fieldErrors });
      }
    });
  }

  const fieldProblems = [
    ...(failure?.fields?.["text"] ?? []).map((m) => ({ targetId: source === "file" ? "structure-file" : "smiles-text", text: `${source === "file" ? "MOL or SD file" : "SMILES"}: ${m}` })),
    ...(failure?.fields?.["tags"] ?? []).map((m) => ({ targetId: "field-tags", text: `Tags: ${m}` })),
  ];
  const onlyDuplicates = outcome?.status === "rejected" && outcome.problems.every((p) => p.code.startsWith("duplicate_"));
  return (
    <div className="space-y-6">
      <ErrorSummary items={fieldProblems} attempt={failure} title="Nothing registered: fix these first" />
      <form
        className="space-y-5 rounded-lg border border-stone-200 bg-white p-5 shadow-xs"
        onSubmit={(e) => {
          e.preventDefault();
          submit(skipDuplicates ? "skip" : "reject");
        }}
      >
        <fieldset className="flex flex-wrap gap-4 text-sm">
          <legend className="mb-2 text-sm font-medium text-stone-800">Structures from</legend>
          {(["paste", "file"] as const).map((s) => (
            <label key={s} className="flex items-center gap-2">
              <input type="radio" name="source" value={s} checked={source === s} onChange={() => setSource(s)} />
              {s === "paste" ? "Pasted SMILES" : "A MOL or SD file"}
            </label>
          ))}
        </fieldset>
        {source === "paste" ? (
          <div className="space-y-1">
            <label htmlFor="smiles-text" className="block text-sm font-medium text-stone-800">SMILES, one structure per line</label>
            <textarea
              id="smiles-text" name="text" rows={8} value={text} onChange={(e) => setText(e.target.value)}
              placeholder={SMILES_EXAMPLE} aria-describedby="smiles-hint" className={`${inputClass} font-mono`} spellCheck={false}
            />
            <p id="smiles-hint" className="text-xs text-stone-500">An optional name follows the SMILES after a space. Lines starting with # are ignored.</p>
          </div>
        ) : (
          <div className="space-y-1">
            <label htmlFor="structure-file" className="block text-sm font-medium text-stone-800">MOL or SD file</label>
            <input id="structure-file" type="file" accept=".mol,.sdf,.sd,.txt" onChange={(e) => setFile(e.target.files?.[0] ?? null)} className="block text-sm" />
            <p className="text-xs text-stone-500">An SD file may hold many records; each record&apos;s title line (or a NAME data field) becomes its name.</p>
          </div>
        )}
        <FieldErrors id="structures-errors" errors={failure?.fields?.["text"]} />
        <Field label="Tags for every compound (optional)" name="tags" value={tags} onChange={(e) => setTags(e.target.value)} placeholder="e.g. amide coupling, series B" hint="Separate tags with commas." errors={failure?.fields?.["tags"]} />
        <label className="flex items-start gap-2 text-sm text-stone-700">
          <input type="checkbox" checked={skipDuplicates} onChange={(e) => setSkipDuplicates(e.target.checked)} className="mt-0.5" />
          <span>Leave out structures the group already has, and repeats within this batch (they are listed, not changed).</span>
        </label>
        <Button type="submit" disabled={pending || (source === "file" ? !file : text.trim() === "")}>
          {pending ? "Checking and registering…" : "Register"}
        </Button>
      </form>
      {failure && fieldProblems.length === 0 ? <Notice tone="error" title={failure.message} /> : null}
      {outcome ? <RegisterReport outcome={outcome} /> : null}
      {onlyDuplicates ? (
        <Button variant="secondary" disabled={pending} onClick={() => submit("skip")}>
          Register the others, leaving out these duplicates
        </Button>
      ) : null}
    </div>
  );
}
