/** @type {import('next').NextConfig} */
const nextConfig = {
  // Loaded from node_modules at run time instead of bundled: RDKit cannot find its .wasm when bundled,
  // and PGlite breaks under webpack (see DEVELOPERS.md, "Build notes").
  serverExternalPackages: [
    "@prisma/client",
    "@prisma/adapter-pg",
    "pg",
    "@electric-sql/pglite",
    "pglite-prisma-adapter",
    "@rdkit/rdkit",
    "bcryptjs",
  ],
  typedRoutes: false,
  // forbidden() and forbidden.tsx, so a page refused by the authorization guard answers 403 (lib/authz/page.ts).
  experimental: { authInterrupts: true },
  poweredByHeader: false,
};

export default nextConfig;
