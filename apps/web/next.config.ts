import path from "node:path";
import { fileURLToPath } from "node:url";
import type { NextConfig } from "next";

const here = path.dirname(fileURLToPath(import.meta.url));

const nextConfig: NextConfig = {
  // Workspace packages export TypeScript source.
  transpilePackages: ["@contend/solver", "@contend/protocol", "@contend/session"],
  // The monorepo root, so the packages under ../../packages resolve.
  turbopack: { root: path.join(here, "../..") },
  outputFileTracingRoot: path.join(here, "../.."),
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;
