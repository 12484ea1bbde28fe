import path from "node:path";
import { defineConfig } from "prisma/config";

// `prisma generate|validate|format` only need *a* schema-engine file to exist; otherwise the CLI tries to download
// the native binary. PRISMA_SCHEMA_ENGINE_BINARY is Prisma's documented custom-engine variable, read after this file.
process.env["PRISMA_SCHEMA_ENGINE_BINARY"] ??= path.resolve("scripts/no-schema-engine.sh");
process.env["CHECKPOINT_DISABLE"] ??= "1";

export default defineConfig({
  schema: "prisma/schema.prisma",
  migrations: { path: "prisma/migrations" },
});
