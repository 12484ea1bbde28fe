import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { EnvError, env, isLoopbackHost, parseEnv, resetEnv } from "@/lib/env";

let cwd: string;
beforeEach(() => {
  cwd = fs.mkdtempSync(path.join(os.tmpdir(), "lw-env-"));
});
afterEach(() => {
  fs.rmSync(cwd, { recursive: true, force: true });
});

const secret = "s".repeat(32);

describe("parseEnv", () => {
  it("defaults to the embedded database in ./data/pglite with seeding on", () => {
    const e = parseEnv({ AUTH_SECRET: secret }, cwd);
    expect(e.databaseUrl).toBeUndefined();
    expect(e.dataDir).toBe(path.join(cwd, "data", "pglite"));
    expect(e.seedOnEmpty).toBe(true);
    expect(e.port).toBe(3000);
    expect(e.oidc).toBeNull();
    expect(e.authSecretSource).toBe("AUTH_SECRET");
  });

  it("uses PostgreSQL when DATABASE_URL is set and then does not seed by default", () => {
    const e = parseEnv({ AUTH_SECRET: secret, DATABASE_URL: "postgresql://u@127.0.0.1:5432/lw" }, cwd);
    expect(e.databaseUrl).toBe("postgresql://u@127.0.0.1:5432/lw");
    expect(e.seedOnEmpty).toBe(false);
    expect(parseEnv({ AUTH_SECRET: secret, DATABASE_URL: "postgresql://x/y", LAYERWISE_SEED_ON_EMPTY: "yes" }, cwd).seedOnEmpty).toBe(true);
  });

  it("treats blank values as unset", () => {
    const e = parseEnv({ AUTH_SECRET: secret, DATABASE_URL: "  ", PORT: "", LAYERWISE_DATA_DIR: "" }, cwd);
    expect(e.databaseUrl).toBeUndefined();
    expect(e.port).toBe(3000);
    expect(e.dataDir).toBe(path.join(cwd, "data", "pglite"));
  });

  it("resolves a relative data dir against the working directory", () => {
    expect(parseEnv({ AUTH_SECRET: secret, LAYERWISE_DATA_DIR: "db/here" }, cwd).dataDir).toBe(path.join(cwd, "db", "here"));
    expect(parseEnv({ AUTH_SECRET: secret, LAYERWISE_DATA_DIR: "/srv/lw" }, cwd).dataDir).toBe("/srv/lw");
  });

  it("rejects a database URL that is not PostgreSQL, naming the variable", () => {
    expect(() => parseEnv({ AUTH_SECRET: secret, DATABASE_URL: "mysql://x/y" }, cwd)).toThrow(/DATABASE_URL: must be a postgresql:\/\//);
  });

  it("rejects bad ports and booleans, listing every problem", () => {
    const bad = () => parseEnv({ AUTH_SECRET: secret, PORT: "70000", LAYERWISE_SEED_ON_EMPTY: "maybe" }, cwd);
    expect(bad).toThrow(EnvError);
    expect(bad).toThrow(/PORT: .*\n.*LAYERWISE_SEED_ON_EMPTY/s);
  });

  it("accepts NEXTAUTH_SECRET when AUTH_SECRET is missing, and prefers AUTH_SECRET", () => {
    expect(parseEnv({ NEXTAUTH_SECRET: "n".repeat(20) }, cwd).authSecret).toBe("n".repeat(20));
    expect(parseEnv({ NEXTAUTH_SECRET: "n".repeat(20), AUTH_SECRET: secret }, cwd).authSecret).toBe(secret);
    expect(() => parseEnv({ AUTH_SECRET: "short" }, cwd)).toThrow(/AUTH_SECRET: must be at least 16/);
  });

  it("generates the dev secret once in the data dir and reuses it", () => {
    const first = parseEnv({}, cwd);
    const file = path.join(cwd, "data", "pglite", "auth-secret");
    expect(first.authSecretSource).toBe(file);
    expect(first.authSecret.length).toBeGreaterThanOrEqual(40);
    expect(parseEnv({}, cwd).authSecret).toBe(first.authSecret);
    expect(fs.statSync(file).mode & 0o077).toBe(0);
  });

  it("configures single sign-on only when issuer, id and secret are all present", () => {
    const all = { OIDC_ISSUER: "https://sso.example.org/realms/lab", OIDC_CLIENT_ID: "lw", OIDC_CLIENT_SECRET: "x" };
    expect(parseEnv({ AUTH_SECRET: secret, ...all }, cwd).oidc).toEqual({
      issuer: "https://sso.example.org/realms/lab", clientId: "lw", clientSecret: "x", name: "Institutional sign-in",
    });
    expect(parseEnv({ AUTH_SECRET: secret, ...all, OIDC_NAME: "Campus login" }, cwd).oidc?.name).toBe("Campus login");
    expect(() => parseEnv({ AUTH_SECRET: secret, OIDC_ISSUER: all.OIDC_ISSUER }, cwd)).toThrow(/missing OIDC_CLIENT_ID, OIDC_CLIENT_SECRET/);
    expect(() => parseEnv({ AUTH_SECRET: secret, ...all, OIDC_ISSUER: "not a url" }, cwd)).toThrow(/OIDC_ISSUER/);
  });
});

describe("listening address and trusted proxies", () => {
  // Before: `npm start` served every interface (next start's default) and X-Forwarded-For was believed from anyone.
  it("listens on this machine only and trusts no proxy unless configured", () => {
    const e = parseEnv({ AUTH_SECRET: secret }, cwd);
    expect(e.host).toBe("127.0.0.1");
    expect(isLoopbackHost(e.host)).toBe(true);
    expect(e.trustedProxies).toEqual([]);
    expect(e.shutdownGraceMs).toBe(10_000);
  });

  it("reads HOST, LAYERWISE_TRUSTED_PROXIES and the grace period, and refuses malformed ones", () => {
    const e = parseEnv({ AUTH_SECRET: secret, HOST: "0.0.0.0", LAYERWISE_TRUSTED_PROXIES: "127.0.0.1, ::1", LAYERWISE_SHUTDOWN_GRACE_SECONDS: "3" }, cwd);
    expect(e.host).toBe("0.0.0.0");
    expect(e.trustedProxies).toEqual(["127.0.0.1", "::1"]);
    expect(e.shutdownGraceMs).toBe(3000);
    expect(() => parseEnv({ AUTH_SECRET: secret, LAYERWISE_TRUSTED_PROXIES: "10.0.0.0/8" }, cwd)).toThrow(/LAYERWISE_TRUSTED_PROXIES/);
    expect(() => parseEnv({ AUTH_SECRET: secret, HOST: "a b" }, cwd)).toThrow(/HOST: must be a host name or an IP address/);
  });

  it("tells loopback addresses from ones other machines reach", () => {
    for (const h of ["127.0.0.1", "127.1.2.3", "localhost", "::1", "[::1]"]) expect(isLoopbackHost(h)).toBe(true);
    for (const h of ["0.0.0.0", "::", "192.168.1.20", "lab-server.example.org"]) expect(isLoopbackHost(h)).toBe(false);
  });
});

describe("env", () => {
  const saved = { ...process.env };
  afterEach(() => {
    process.env = { ...saved };
    resetEnv();
  });

  it("caches the parsed process environment until reset", () => {
    process.env["AUTH_SECRET"] = secret;
    process.env["PORT"] = "4100";
    expect(env().port).toBe(4100);
    process.env["PORT"] = "4200";
    expect(env().port).toBe(4100);
    resetEnv();
    expect(env().port).toBe(4200);
  });
});
