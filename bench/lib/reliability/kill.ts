// kill -9 under load: concurrent writers create workups and report their outcomes through the API, each writer
// noting every write the server acknowledged (2xx with the id); the server is killed with SIGKILL at a random
// moment, started again on the same data, and every acknowledged write is looked up. One that is missing (or whose
// values differ) was acknowledged but not durable.
import { type Instance, killServer, startServer } from "./server";
import { type People, workupBody } from "./fixtures";
import { ask, bearer, jsonHeaders, pool } from "./http";

interface Ack {
  kind: "workup" | "outcome";
  workupId: string;
  title?: string;
  massMg?: number;
}

export interface RoundResult {
  round: number;
  killedAfterMs: number;
  acknowledged: number;
  acknowledgedWorkups: number;
  acknowledgedOutcomes: number;
  /** Requests that were cut off by the kill (no answer): neither acknowledged nor counted as lost. */
  cutOff: number;
  lost: number;
  restartMs: number;
  lostDetails: string[];
}

export interface KillResult {
  rounds: RoundResult[];
  writers: number;
  acknowledged: number;
  lost: number;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function verify(instance: Instance, token: string, acks: Ack[]): Promise<string[]> {
  const latestOutcome = new Map<string, number>();
  for (const a of acks) if (a.kind === "outcome" && a.massMg !== undefined) latestOutcome.set(a.workupId, a.massMg);
  const workups = acks.filter((a) => a.kind === "workup");
  const lost: string[] = [];
  await pool(workups, 4, async (a) => {
    const res = await ask(instance.base, `/api/v1/workups/${a.workupId}`, { headers: bearer(token), timeoutMs: 60_000 });
    if (res.status !== 200) {
      lost.push(`workup ${a.workupId} (${a.title ?? ""}): ${res.status}`);
      if (latestOutcome.has(a.workupId)) lost.push(`outcome of ${a.workupId}: its workup is gone`);
      return;
    }
    const detail = JSON.parse(res.body) as { title?: string; header?: { title?: string }; outcome?: { isolatedMassMg?: number } | null };
    const title = detail.title ?? detail.header?.title;
    if (title !== a.title) lost.push(`workup ${a.workupId}: title ${JSON.stringify(title)} instead of ${JSON.stringify(a.title)}`);
    const mass = latestOutcome.get(a.workupId);
    if (mass !== undefined && detail.outcome?.isolatedMassMg !== mass) lost.push(`outcome of ${a.workupId}: ${detail.outcome?.isolatedMassMg ?? "none"} mg instead of ${mass} mg`);
  });
  return lost;
}

export async function killRounds(instance: Instance, root: string, people: People, options: { rounds: number; writers: number; minMs: number; maxMs: number }): Promise<KillResult> {
  const token = people.member.token;
  const rounds: RoundResult[] = [];
  for (let round = 1; round <= options.rounds; round++) {
    if (!instance.child) await startServer(instance);
    const acks: Ack[] = [];
    let cutOff = 0;
    let stop = false;
    const writer = async (w: number) => {
      for (let seq = 0; !stop; seq++) {
        const title = `Kill round ${round} writer ${w} #${seq}`;
        const created = await ask(instance.base, "/api/v1/workups", { method: "POST", headers: jsonHeaders(token), body: JSON.stringify(workupBody(root, title)), timeoutMs: 60_000 });
        if (created.failure) {
          cutOff++;
          await sleep(100);
          continue;
        }
        if (created.status !== 201) continue;
        const id = (JSON.parse(created.body) as { id: string }).id;
        acks.push({ kind: "workup", workupId: id, title });
        const massMg = 100_000 * round + 1000 * w + (seq % 1000);
        const reported = await ask(instance.base, `/api/v1/workups/${id}/outcome`, { method: "POST", headers: jsonHeaders(token), body: JSON.stringify({ isolatedMassMg: massMg, purityPct: 95, purityMethod: "qnmr", notes: title }), timeoutMs: 60_000 });
        if (reported.failure) cutOff++;
        else if (reported.status === 200) acks.push({ kind: "outcome", workupId: id, massMg });
      }
    };
    const t0 = Date.now();
    const running = Promise.all(Array.from({ length: options.writers }, (_, w) => writer(w)));
    // A restarted server is cold (route modules, the structure toolkit): the random moment is counted from the first
    // acknowledged writes, so every round kills a server that is busy writing.
    for (let waited = 0; acks.length < options.writers && waited < 120_000; waited += 100) await sleep(100);
    const killAt = options.minMs + Math.random() * (options.maxMs - options.minMs);
    await sleep(killAt);
    stop = true; // no new requests; the ones in flight are cut off by the kill
    await killServer(instance);
    const killedAfterMs = Date.now() - t0;
    await running;
    const r0 = Date.now();
    await startServer(instance);
    const restartMs = Date.now() - r0;
    const lostDetails = await verify(instance, token, acks);
    rounds.push({
      round, killedAfterMs, acknowledged: acks.length,
      acknowledgedWorkups: acks.filter((a) => a.kind === "workup").length,
      acknowledgedOutcomes: acks.filter((a) => a.kind === "outcome").length,
      cutOff, lost: lostDetails.length, restartMs, lostDetails: lostDetails.slice(0, 20),
    });
    console.log(`  round ${round}: killed after ${(killedAfterMs / 1000).toFixed(1)} s, ${acks.length} acknowledged, ${cutOff} cut off, ${lostDetails.length} lost; restart ${(restartMs / 1000).toFixed(1)} s`);
  }
  return {
    rounds, writers: options.writers,
    acknowledged: rounds.reduce((s, r) => s + r.acknowledged, 0),
    lost: rounds.reduce((s, r) => s + r.lost, 0),
  };
}
