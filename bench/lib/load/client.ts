/**
 * The simulated member's side of the load benchmark: sign-in through the real credentials endpoint, and the route
 * mix of a group's day (workup list and pages, the review page, compound text search, API reads, about 10 % writes).
 */

export const DEMO_PEOPLE = ["maren.holloway@example.org", "tomas.ferreira@example.org", "aiko.brandt@example.org", "jonah.mercer@example.org"];
const SEARCH_WORDS = ["amide", "ester", "acid", "amine", "wash", "bicarbonate", "benz", "extraction"];

/** Only addresses on this machine are benchmark targets. */
export function assertLocal(url: URL): void {
  const h = url.hostname;
  if (!["127.0.0.1", "localhost", "[::1]"].includes(h) && !h.startsWith("127.")) {
    throw new Error(`refusing to send load to ${h}: only addresses on this machine are benchmark targets`);
  }
}

function cookiesOf(res: Response, jar: Map<string, string>): void {
  for (const line of res.headers.getSetCookie()) {
    const [pair] = line.split(";");
    const eq = pair?.indexOf("=") ?? -1;
    if (pair && eq > 0) jar.set(pair.slice(0, eq).trim(), pair.slice(eq + 1).trim());
  }
}

const cookieHeader = (jar: Map<string, string>) => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");

/** Signs in as `email` and answers the Cookie header of the session. */
export async function signIn(base: URL, email: string, password: string): Promise<string> {
  const jar = new Map<string, string>();
  const csrf = await fetch(new URL("/api/auth/csrf", base));
  cookiesOf(csrf, jar);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(new URL("/api/auth/callback/credentials", base), {
    method: "POST", redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookieHeader(jar), origin: base.origin },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  cookiesOf(res, jar);
  if (![...jar.keys()].some((k) => k.includes("session-token"))) throw new Error(`sign-in as ${email} failed (${res.status})`);
  return cookieHeader(jar);
}

/** Ids of the group's workups the simulated members open. */
export async function workupIds(base: URL, cookie: string): Promise<string[]> {
  const list = await fetch(new URL("/api/v1/workups?limit=100", base), { headers: { cookie } });
  if (!list.ok) throw new Error(`GET /api/v1/workups answered ${list.status}`);
  const ids = ((await list.json()) as { rows: { id: string }[] }).rows.map((r) => r.id);
  if (ids.length === 0) throw new Error("no workups to read: start the instance with its demo data");
  return ids;
}

export interface Step { route: string; weight: number; write?: boolean; run: (cookie: string) => Promise<Response> }

/** The route mix; weights are percent of requests. */
export function routeMix(base: URL, ids: string[]): Step[] {
  const pick = <T>(xs: T[]) => xs[Math.floor(Math.random() * xs.length)] as T;
  const get = (path: () => string) => (cookie: string) => fetch(new URL(path(), base), { headers: { cookie }, redirect: "manual" });
  return [
    { route: "page /workups", weight: 20, run: get(() => "/workups") },
    { route: "page /workups/{id}", weight: 20, run: get(() => `/workups/${pick(ids)}`) },
    { route: "page /review", weight: 10, run: get(() => "/review") },
    { route: "api text search", weight: 15, run: get(() => `/api/v1/compounds?mode=text&query=${pick(SEARCH_WORDS)}`) },
    { route: "api GET /workups", weight: 15, run: get(() => "/api/v1/workups?limit=20") },
    { route: "api GET /workups/{id}", weight: 10, run: get(() => `/api/v1/workups/${pick(ids)}`) },
    {
      route: "api POST /workups/{id}/outcome", weight: 10, write: true,
      run: (cookie) => fetch(new URL(`/api/v1/workups/${pick(ids)}/outcome`, base), {
        method: "POST",
        headers: { cookie, "content-type": "application/json", origin: base.origin, "sec-fetch-site": "same-origin" },
        body: JSON.stringify({ isolatedMassMg: 400 + Math.round(Math.random() * 400), purityPct: 95, purityMethod: "qnmr", notes: "load benchmark" }),
      }),
    },
  ];
}

export function chooser(steps: Step[]): () => Step {
  const total = steps.reduce((s, x) => s + x.weight, 0);
  return () => {
    let r = Math.random() * total;
    for (const s of steps) if ((r -= s.weight) < 0) return s;
    return steps[0]!;
  };
}
