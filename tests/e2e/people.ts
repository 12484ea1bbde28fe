// The people and records of the browser tests: two invented groups. Created through the data layer by prepare.ts,
// signed in through the real sign-in form by the specs.
export const PASSWORD = "e2e-partition-coeff-9";

export const GROUP_A = { name: "Heron Lab", slug: "heron-lab" };
export const GROUP_B = { name: "Kestrel Lab", slug: "kestrel-lab" };

export const PEOPLE = {
  leadA: { name: "Noor Vasquez", email: "noor.vasquez@heron.example", group: "A", role: "lead" },
  memberA: { name: "Tomas Reyes", email: "tomas.reyes@heron.example", group: "A", role: "member" },
  viewerA: { name: "Ilse Marten", email: "ilse.marten@heron.example", group: "A", role: "viewer" },
  memberB: { name: "Ada Osei", email: "ada.osei@kestrel.example", group: "B", role: "member" },
  lockout: { name: "Pim Lockwood", email: "pim.lockwood@heron.example", group: "A", role: "member" },
} as const;

export type Person = (typeof PEOPLE)[keyof typeof PEOPLE];

export const WORKUP_A_TITLE = "Bicarbonate wash of the Fischer ester";
export const WORKUP_B_TITLE = "Acid extraction of the aniline";

/** Written by prepare.ts next to the data directory, read by the specs. */
export interface E2eFixtures {
  workupA: string;
  workupB: string;
}
