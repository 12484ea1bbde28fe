"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { deleteCompoundAction } from "@/lib/compounds/actions";
import { ConfirmChange } from "./confirm-change";

/** Only a compound no workup or partition observation uses can be deleted; the action says so otherwise. */
export function DeleteCompound({ compoundId, name }: { compoundId: string; name: string }) {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  if (!asking) return <Button variant="danger" onClick={() => setAsking(true)}>Delete</Button>;
  return (
    <ConfirmChange
      summary={<>Delete <strong>{name}</strong> from the registry? This cannot be undone.</>}
      save={async () => {
        const result = await deleteCompoundAction({ compoundId });
        if (result.ok) router.push("/compounds");
        return result;
      }}
      onBack={() => setAsking(false)}
      confirmLabel="Delete the compound"
    />
  );
}
