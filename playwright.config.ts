// Browser tests drive Debian's Chromium (/usr/bin/chromium); no browser is ever downloaded.
// The web server runs the production build (rebuilt by scripts/ensure-build.mjs when the sources changed) against a fresh embedded
// database under .tmp/, prepared through the data layer by tests/e2e/prepare.ts, on a free port.
import { createServer } from "node:net";
import path from "node:path";
import { defineConfig } from "@playwright/test";

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.unref();
    server.on("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() => (typeof address === "object" && address ? resolve(address.port) : reject(new Error("no port"))));
    });
  });
}

// Chosen once in the runner and inherited by its workers through the environment.
process.env["LW_E2E_PORT"] ??= String(await freePort());
process.env["LW_E2E_DATA_DIR"] ??= path.resolve(".tmp", `e2e-${Date.now()}`);
const port = process.env["LW_E2E_PORT"];
const baseURL = `http://127.0.0.1:${port}`;

const serve = [
  "npx tsx tests/e2e/prepare.ts",
  "node scripts/ensure-build.mjs",
  `npx next start -H 127.0.0.1 -p ${port}`,
].join(" && ");

export default defineConfig({
  testDir: "tests/e2e",
  timeout: 60_000,
  expect: { timeout: 15_000 },
  fullyParallel: false,
  workers: 1,
  retries: 0,
  reporter: [["list"]],
  outputDir: ".tmp/playwright-results",
  use: {
    baseURL,
    trace: "retain-on-failure",
    browserName: "chromium",
    launchOptions: {
      executablePath: "/usr/bin/chromium",
      args: [
        "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
        "--disable-background-networking", "--disable-component-update", "--disable-sync",
      ],
    },
  },
  webServer: {
    command: serve,
    url: `${baseURL}/sign-in`,
    timeout: 15 * 60_000,
    reuseExistingServer: false,
    stdout: "pipe",
    stderr: "pipe",
    env: {
      LAYERWISE_DATA_DIR: process.env["LW_E2E_DATA_DIR"],
      DATABASE_URL: "",
      AUTH_SECRET: "e2e-only-secret-not-for-production-0123",
      NEXTAUTH_URL: baseURL,
      PORT: port,
      LAYERWISE_SEED_ON_EMPTY: "false",
    },
  },
});
