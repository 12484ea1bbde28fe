// `npm run demo:accounts -- rotate`  gives each demo account a new random password and prints it once;
// `npm run demo:accounts -- lock`    removes the demo accounts' passwords (they can no longer sign in).
// Either is needed before serving other machines (HOST other than 127.0.0.1): scripts/prepare-db.ts refuses to start
// such an instance while a demo account keeps the published password. Run it while the server is stopped.
import { openConfiguredDb } from "@/lib/db/client";
import { lockDemoAccounts, rotateDemoPasswords } from "@/seed/demo-accounts";

const mode = process.argv[2];
let exitCode = 0;
if (mode !== "rotate" && mode !== "lock") {
  console.error('Usage: npm run demo:accounts -- rotate   (or: lock)');
  exitCode = 2;
} else {
  const { db, close } = await openConfiguredDb();
  try {
    if (mode === "rotate") {
      const rotated = await rotateDemoPasswords(db);
      console.log(rotated.length === 0 ? "No demo accounts in this database." : "New demo passwords (shown once):");
      for (const { email, password } of rotated) console.log(`  ${email}  ${password}`);
    } else {
      console.log(`Locked ${await lockDemoAccounts(db)} demo account(s): they can no longer sign in with a password.`);
    }
  } catch (e) {
    console.error(e instanceof Error ? e.message : e);
    exitCode = 1;
  } finally {
    await close();
  }
}
// Closing PGlite resets process.exitCode (emscripten exit), so exit explicitly.
process.exit(exitCode);
