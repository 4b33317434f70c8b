import path from "node:path";
import { fileURLToPath } from "node:url";
import type { NextConfig } from "next";

const here = path.dirname(fileURLToPath(import.meta.url));

// `next dev` beside a separate Contend server: REST calls stay same-origin through a rewrite
// (the server sends no CORS headers); the socket connects to the server directly, which must
// list this origin in its ALLOWED_ORIGINS.
const serverUrl = (process.env.NEXT_PUBLIC_SERVER_URL ?? "").trim().replace(/\/+$/, "");

const nextConfig: NextConfig = {
  // Workspace packages export TypeScript source.
  transpilePackages: ["@contend/solver", "@contend/protocol", "@contend/session"],
  // The monorepo root, so the packages under ../../packages resolve.
  turbopack: { root: path.join(here, "../..") },
  outputFileTracingRoot: path.join(here, "../.."),
  poweredByHeader: false,
  reactStrictMode: true,
  async rewrites() {
    return serverUrl === ""
      ? []
      : [{ source: "/api/:path*", destination: `${serverUrl}/api/:path*` }];
  },
};

export default nextConfig;
