/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // The test runner type-checks the whole project with tsc first and then says so here, so the
  // build does not check everything a second time. A plain `next build` still type-checks.
  typescript: { ignoreBuildErrors: process.env.LOOPWRIGHT_TYPECHECKED === "1" },
  // Server-only packages with native parts or Node APIs stay out of the bundle.
  serverExternalPackages: ["@node-rs/argon2", "postgres", "nodemailer", "pg-boss", "pdfkit"],
  experimental: {
    serverActions: {
      // Forged posts from another origin are refused by Next's Origin/Host check; a reverse
      // proxy's public host can be allowed here through the environment.
      allowedOrigins: process.env.APP_ALLOWED_ORIGINS ? process.env.APP_ALLOWED_ORIGINS.split(",") : [],
      // an attempt submission carries its whole action log (at most 20 000 actions)
      bodySizeLimit: "4mb",
    },
  },
};
export default nextConfig;
