// One "app instance" for two-processes.test.ts: its own database client and its own in-memory search index, driven
// by JSON lines on stdin ({ id, op, ... }) and answering JSON lines on stdout ({ id, ok, result | error }).
// Run: tsx tests/integration/compounds/search-instance.ts <postgresql-url>
import readline from "node:readline";
import { createDb } from "@/lib/db/client";
import { deleteCompound } from "@/lib/compounds/edits";
import { registerCompoundsSchema, searchSchema } from "@/lib/compounds/schemas";
import { CompoundSearchService } from "@/lib/compounds/search-service";
import { registerCompounds, type CompoundActor } from "@/lib/compounds/service";

interface Command {
  id: number;
  op: "register" | "search" | "delete" | "quit";
  actor: CompoundActor;
  input?: unknown;
  compoundId?: string;
}

const url = process.argv[2];
if (!url) throw new Error("usage: search-instance.ts <database url>");
const { db, close } = await createDb({ url, migrate: false });
const service = new CompoundSearchService();
const say = (message: object) => process.stdout.write(`${JSON.stringify(message)}\n`);
say({ ready: true, pid: process.pid });

for await (const line of readline.createInterface({ input: process.stdin })) {
  const command = JSON.parse(line) as Command;
  if (command.op === "quit") break;
  try {
    const result =
      command.op === "register" ? await registerCompounds(db, command.actor, registerCompoundsSchema.parse(command.input))
      : command.op === "search" ? await service.searchIds(db, command.actor.groupId, searchSchema.parse(command.input))
      : await deleteCompound(db, command.actor, command.compoundId ?? "");
    say({ id: command.id, ok: true, result: result ?? null, indexed: service.indexedIds(command.actor.groupId).length });
  } catch (error) {
    say({ id: command.id, ok: false, error: error instanceof Error ? error.message : String(error) });
  }
}
await close();
process.exit(0); // stdin stays open after the loop ends, which would keep the process alive
