#!/usr/bin/env node
// Offline stand-in for `prisma migrate dev|deploy|status|reset|diff` and `prisma db push` (PostgreSQL provider only),
// running Prisma's own schema engine compiled to WebAssembly (@prisma/schema-engine-wasm) over a JS driver adapter.
// No native binaries, no network. Writes/reads the same prisma/migrations/* folders and _prisma_migrations table as the CLI.
//
//   DATABASE_URL=postgresql://user@host:5432/db   (PostgreSQL through @prisma/adapter-pg; temp shadow DBs need CREATEDB)
//   DATABASE_URL=pglite:./data/pglite             (embedded PGlite data dir; `pglite:memory` = throw-away in-memory DB)
//
//   node scripts/prisma-offline.mjs diff [--from-empty|--from-migrations|--from-database]
//                                  SQL that takes an empty database / the migrations folder / the live database to the schema
//   node scripts/prisma-offline.mjs dev --name <name> [--create-only]       = prisma migrate dev
//   node scripts/prisma-offline.mjs deploy                                  = prisma migrate deploy
//   node scripts/prisma-offline.mjs status                                  = prisma migrate status (exit 1 if not in sync)
//   node scripts/prisma-offline.mjs push [--accept-data-loss]               = prisma db push
//   node scripts/prisma-offline.mjs resolve --applied N | --rolled-back N   = prisma migrate resolve
//   node scripts/prisma-offline.mjs reset --force                           = prisma migrate reset (drop all, re-apply)
//   options: --schema prisma/schema.prisma  --migrations prisma/migrations ; DEBUG_SCHEMA_ENGINE=1 for engine logs
//
// Add a migration (no database needed): npm run db:new-migration -- <name>   (= DATABASE_URL=pglite:memory ... dev --create-only)
// The app applies committed migrations itself (lib/db/migrate.ts); `deploy` here is Prisma's own engine doing the same.
// Never point this tool at a PGlite data dir the app has open: it takes the same lock file as the app (lib/db/lock.ts).
import fs from 'node:fs';
import fsp from 'node:fs/promises';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { createRequire } from 'node:module';
import { parseArgs } from 'node:util';
import * as bg from '@prisma/schema-engine-wasm/schema_engine_bg';
import { bindMigrationAwareSqlAdapterFactory } from '@prisma/driver-adapter-utils';

const require = createRequire(import.meta.url);

// ---------- wasm engine -------------------------------------------------------------------------------------------
function loadSchemaEngineWasm() {
  // the wasm-bindgen glue reports Rust panics through this global (the Prisma CLI defines it the same way)
  globalThis.PRISMA_WASM_PANIC_REGISTRY ??= { message: '', set_message(m) { this.message = `RuntimeError: ${m}`; } };
  const file = path.join(path.dirname(require.resolve('@prisma/schema-engine-wasm/schema_engine_bg')), 'schema_engine_bg.wasm');
  const instance = new WebAssembly.Instance(new WebAssembly.Module(fs.readFileSync(file)), { './schema_engine_bg.js': bg });
  bg.__wbg_set_wasm(instance.exports);
  instance.exports.__wbindgen_start();
  return bg.SchemaEngine;
}

// Errors thrown inside the JS adapter reach us as "External error id#N"; the original is kept in the error registry.
function unwrap(registry, e) {
  const m = /External error id#(\d+)/.exec(e?.message ?? '');
  return (m && registry.consumeError?.(Number(m[1]))?.error) || e;
}

// ---------- driver adapter factories (SqlMigrationAwareDriverAdapterFactory) ---------------------------------------
async function pgFactory(url) {
  const { default: pg } = await import('pg');
  const { PrismaPg } = await import('@prisma/adapter-pg');
  const { parseIntoClientConfig } = await import('pg-connection-string');
  const config = parseIntoClientConfig(url); // never pass {connectionString}: pg lets it override `database` (shadow DB!)
  const schema = new URL(url).searchParams.get('schema') ?? undefined;
  const connect = async (cfg, opts) => {
    const pool = new pg.Pool({ ...cfg, max: 1 }); // one session: pg_advisory_lock(72707369) is session-scoped
    // adapter-pg 7.10 rejects the "char" type (OID 18) that the engine's catalog queries return -> report it as text
    const query = pool.query.bind(pool);
    const fix = (r) => { for (const f of r?.fields ?? []) if (f.dataTypeID === 18) f.dataTypeID = 25; return r; };
    pool.query = (...a) => { const p = query(...a); return typeof p?.then === 'function' ? p.then(fix) : p; };
    const adapter = await new PrismaPg(pool, { disposeExternalPool: true, ...opts }).connect();
    // adapter-pg's executeScript splits on ';' and runs statements one by one (non-atomic, breaks $$ bodies);
    // the native engine sends the whole migration in one simple query (implicit transaction). Do that.
    adapter.executeScript = async (sql) => { try { await adapter.client.query(sql); } catch (e) { adapter.onError(e); } };
    return adapter;
  };
  return {
    provider: 'postgres',
    adapterName: '@prisma/adapter-pg',
    connect: () => connect(config, schema ? { schema } : undefined),
    // adapter-pg's own connectToShadowDb() connects to the MAIN db when given a connectionString and drops the
    // temp db before closing its pool (fails). Temp database like the CLI's, created/dropped on the admin session.
    async connectToShadowDb() {
      const admin = await connect(config);
      const database = `prisma_migrate_shadow_db_${randomUUID()}`;
      await admin.executeScript(`CREATE DATABASE "${database}"`);
      const shadow = await connect({ ...config, database });
      const dispose = shadow.dispose.bind(shadow);
      shadow.dispose = async () => {
        await dispose();
        await admin.executeScript(`DROP DATABASE IF EXISTS "${database}" WITH (FORCE)`);
        await admin.dispose();
      };
      return shadow;
    },
  };
}

async function pgliteFactory(dataDir) {
  const { PGlite } = await import('@electric-sql/pglite');
  const { PrismaPGlite } = await import('pglite-prisma-adapter');
  const open = (dir) => {
    if (dir !== 'memory') fs.mkdirSync(dir, { recursive: true }); // PGlite does not create parent folders
    return dir === 'memory' ? new PGlite() : new PGlite(dir);
  };
  const connect = async (db, ownsDb) => {
    const adapter = await new PrismaPGlite(db).connect();
    // pglite-prisma-adapter 0.7.2 does not await exec(): a failing migration would be recorded as applied
    adapter.executeScript = async (sql) => { try { await db.exec(sql); } catch (e) { adapter.onError(e); } };
    if (ownsDb) adapter.dispose = () => db.close();
    return adapter;
  };
  const unlock = dataDir === 'memory' ? () => {} : lockDataDir(dataDir);
  const main = open(dataDir);
  return {
    provider: 'postgres',
    adapterName: 'pglite-prisma-adapter',
    connect: () => connect(main, false),
    connectToShadowDb: () => connect(new PGlite(), true), // fresh in-memory PGlite per shadow use
    close: async () => { await main.close(); unlock(); },
  };
}

// Same lock file and format as lib/db/lock.ts: <dataDir>/layerwise.lock holding the owner's pid.
function lockDataDir(dir) {
  fs.mkdirSync(dir, { recursive: true });
  const file = path.join(dir, 'layerwise.lock');
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      fs.writeFileSync(file, `${process.pid}\n`, { flag: 'wx' });
      return () => fs.rmSync(file, { force: true });
    } catch (e) {
      if (e.code !== 'EEXIST') throw e;
    }
    const pid = Number.parseInt(fs.readFileSync(file, 'utf8'), 10);
    let alive = false;
    try { process.kill(pid, 0); alive = true; } catch (e) { alive = e.code === 'EPERM'; }
    if (Number.isInteger(pid) && pid > 0 && alive) {
      throw new Error(`The embedded database at ${dir} is already in use by process ${pid}. Stop that process first.`);
    }
    fs.rmSync(file, { force: true }); // stale: its owner is gone
  }
  throw new Error(`Could not lock ${dir}`);
}

// ---------- migrations folder (same layout/logic as the Prisma CLI) ------------------------------------------------
async function listMigrations(dir) {
  const baseDir = path.resolve(dir);
  const lockContent = await fsp.readFile(path.join(baseDir, 'migration_lock.toml'), 'utf8').catch(() => null);
  const entries = await fsp.readdir(baseDir, { withFileTypes: true }).catch(() => []);
  const migrationDirectories = [];
  for (const e of entries.filter((e) => e.isDirectory())) {
    const content = await fsp.readFile(path.join(baseDir, e.name, 'migration.sql'), 'utf8')
      .then((value) => ({ tag: 'ok', value }), (err) => ({ tag: 'error', value: err.message }));
    migrationDirectories.push({ path: e.name, migrationFile: { path: 'migration.sql', content } });
  }
  migrationDirectories.sort((a, b) => a.path.localeCompare(b.path));
  return { baseDir, lockfile: { path: 'migration_lock.toml', content: lockContent }, migrationDirectories, shadowDbInitScript: '' };
}

async function writeMigration(dir, out) {
  const target = path.join(path.resolve(dir), out.generatedMigrationName);
  await fsp.mkdir(target, { recursive: true });
  await fsp.writeFile(path.join(target, `migration.${out.extension}`), out.migrationScript, 'utf8');
  await fsp.writeFile(path.join(path.resolve(dir), 'migration_lock.toml'),
    `# Please do not edit this file manually\n# It should be added in your version-control system (e.g., Git)\nprovider = "${out.connectorType}"\n`, 'utf8');
  return target;
}

async function readSchemaFiles(p) {
  if ((await fsp.stat(p)).isFile()) return [{ path: path.resolve(p), content: await fsp.readFile(p, 'utf8') }];
  const names = (await fsp.readdir(p, { recursive: true })).filter((f) => f.endsWith('.prisma')).sort();
  return Promise.all(names.map(async (f) => ({ path: path.resolve(p, f), content: await fsp.readFile(path.join(p, f), 'utf8') })));
}

// ---------- CLI ----------------------------------------------------------------------------------------------------
const { values: opt, positionals } = parseArgs({
  allowPositionals: true,
  options: {
    schema: { type: 'string', default: 'prisma/schema.prisma' },
    migrations: { type: 'string', default: 'prisma/migrations' },
    name: { type: 'string' },
    'create-only': { type: 'boolean' },
    'from-empty': { type: 'boolean' },
    'from-migrations': { type: 'boolean' },
    'from-database': { type: 'boolean' },
    'accept-data-loss': { type: 'boolean' },
    force: { type: 'boolean' },
    applied: { type: 'string' },
    'rolled-back': { type: 'string' },
  },
});
const cmd = positionals[0];
const url = process.env.DATABASE_URL ?? 'pglite:memory';
const noFilter = { externalTables: [], externalEnums: [] };
let exitCode = 0; // not process.exitCode: closing PGlite (emscripten exit) resets it

const files = await readSchemaFiles(opt.schema);
const schema = { files: files.map(({ path, content }) => ({ path, content })) };
const factory = await (url.startsWith('pglite:') ? pgliteFactory(url.slice('pglite:'.length)) : pgFactory(url)).catch((e) => {
  console.error(e.message);
  process.exit(1);
});
const opened = new Set(); // the engine never disposes its main connection: track adapters and close them at the end
const track = (fn) => async () => { const a = await fn(); opened.add(a); const d = a.dispose.bind(a); a.dispose = async () => { if (opened.delete(a)) await d(); }; return a; };
const bound = bindMigrationAwareSqlAdapterFactory({ ...factory, connect: track(factory.connect), connectToShadowDb: track(factory.connectToShadowDb) });

let engine;
try {
  const SchemaEngine = loadSchemaEngineWasm();
  engine = await SchemaEngine.new({ datamodels: files.map((f) => [f.path, f.content]) }, (line) => process.env.DEBUG_SCHEMA_ENGINE && console.error(line), bound);
  const migrationsList = await listMigrations(opt.migrations);
  switch (cmd) {
    case 'diff': {
      const from = opt['from-migrations'] ? { tag: 'migrations', ...migrationsList } : opt['from-database'] ? { tag: 'schemaDatasource', ...schema, configDir: process.cwd() } : { tag: 'empty' };
      const r = await engine.diff({ from, to: { tag: 'schemaDatamodel', ...schema }, script: true, exitCode: null, filters: noFilter });
      process.stdout.write(r.stdout ?? '');
      break;
    }
    case 'dev': {
      if (!opt.name) throw new Error('--name is required');
      // devDiagnostic replays the migrations on a shadow DB and caches the result in the engine; createMigration only
      // works after it (otherwise: "PostgreSQL shadow DB must be provided through an external factory").
      const diag = await engine.devDiagnostic({ migrationsList, filters: noFilter });
      if (diag.action.tag === 'reset') throw new Error(`${diag.action.reason}\nRun "reset --force" (drops all data) or fix the database.`);
      // like the CLI (also with --create-only): apply pending migrations first, then check data loss
      const { appliedMigrationNames } = await engine.applyMigrations({ migrationsList, filters: noFilter });
      for (const n of appliedMigrationNames) console.error(`applied ${n}`);
      // the wasm engine only hands the shadow-DB factory to diff/devDiagnostic/diagnoseMigrationHistory; evaluateDataLoss
      // and createMigration reuse the schema cached for the *applied* migrations, so refresh it after applying.
      if (appliedMigrationNames.length) await engine.devDiagnostic({ migrationsList, filters: noFilter });
      const loss = await engine.evaluateDataLoss({ migrationsList, schema, filters: noFilter });
      if (loss.unexecutableSteps.length) throw new Error(loss.unexecutableSteps.map((s) => s.message).join('\n'));
      for (const w of loss.warnings) console.error(`warning: ${w.message}`);
      const out = await engine.createMigration({ migrationName: opt.name, draft: !!opt['create-only'], migrationsList, schema, filters: noFilter });
      if (out.migrationScript == null) { console.error('Already in sync, no migration created.'); break; }
      console.error(`created ${path.relative(process.cwd(), await writeMigration(opt.migrations, out))}`);
      if (!opt['create-only']) {
        const { appliedMigrationNames } = await engine.applyMigrations({ migrationsList: await listMigrations(opt.migrations), filters: noFilter });
        for (const n of appliedMigrationNames) console.error(`applied ${n}`);
      }
      break;
    }
    case 'deploy': {
      const { appliedMigrationNames } = await engine.applyMigrations({ migrationsList, filters: noFilter });
      console.error(appliedMigrationNames.length ? appliedMigrationNames.map((n) => `applied ${n}`).join('\n') : 'No pending migrations to apply.');
      break;
    }
    case 'status': {
      const r = await engine.diagnoseMigrationHistory({ migrationsList, optInToShadowDatabase: false, filters: noFilter });
      console.log(JSON.stringify(r, null, 2));
      if (r.history || r.failedMigrationNames.length || r.editedMigrationNames.length) exitCode = 1;
      break;
    }
    case 'push': {
      const r = await engine.schemaPush({ force: !!opt['accept-data-loss'], schema, filters: noFilter });
      if (r.unexecutable.length || (r.warnings.length && !opt['accept-data-loss'])) throw new Error([...r.unexecutable, ...r.warnings].join('\n') + '\n(use --accept-data-loss)');
      console.error(`db push: ${r.executedSteps} step(s) executed`);
      break;
    }
    case 'resolve': { // = prisma migrate resolve --applied NAME | --rolled-back NAME
      if (opt.applied) await engine.markMigrationApplied({ migrationName: opt.applied, migrationsList });
      else if (opt['rolled-back']) await engine.markMigrationRolledBack({ migrationName: opt['rolled-back'] });
      else throw new Error('resolve needs --applied NAME or --rolled-back NAME');
      console.error('resolved');
      break;
    }
    case 'reset': {
      if (!opt.force) throw new Error('reset drops all data: pass --force');
      await engine.reset({ filter: noFilter });
      const { appliedMigrationNames } = await engine.applyMigrations({ migrationsList, filters: noFilter });
      console.error(`reset; applied ${appliedMigrationNames.join(', ') || 'nothing'}`);
      break;
    }
    default:
      throw new Error(`unknown command ${cmd ?? ''} (diff|dev|deploy|status|push|resolve|reset)`);
  }
} catch (e) {
  const err = unwrap(bound.errorRegistry, e);
  console.error(err?.code ? `${err.code}: ${err.message}` : err);
  exitCode = 1;
} finally {
  engine?.free();
  for (const a of [...opened]) await a.dispose().catch(() => {});
  await factory.close?.();
  // applyMigrations leaves the engine's 10 s advisory-lock timeout timer pending; exit like the Prisma CLI does
  process.exit(exitCode);
}
