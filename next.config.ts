import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  poweredByHeader: false,
  // Server-only packages with native code or dynamic requires stay outside the bundle.
  serverExternalPackages: ["knex", "mysql2", "@node-rs/argon2", "nodemailer", "bwip-js"],
  experimental: {
    // forbidden() renders forbidden.tsx with a 403 status for a page a role may not see.
    authInterrupts: true,
  },
};

export default nextConfig;
