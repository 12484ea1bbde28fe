// Ids for workups created here rather than by the database: the prediction's Monte Carlo seed is derived from the id
// (prediction.ts seedFromId), so the id must exist before the row does. Same look as Prisma's cuid(): "c", the time
// in base 36, then random base-36 characters; sortable by creation time like the ids the database makes.
import { randomBytes } from "node:crypto";

let counter = 0;

export function newRecordId(): string {
  counter = (counter + 1) % 1296;
  const time = Date.now().toString(36).padStart(9, "0");
  const random = BigInt(`0x${randomBytes(8).toString("hex")}`).toString(36).padStart(13, "0").slice(-13);
  return `c${time}${counter.toString(36).padStart(2, "0")}${random}`;
}
