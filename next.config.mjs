/** @type {import('next').NextConfig} */
const nextConfig = {
  // Test runs build into their own folder per source version (scripts/lib/build.mjs), so a
  // running test server is never rebuilt underneath.
  distDir: process.env.TW_DIST_DIR || ".next",
  // These packages load drivers and migrations dynamically; bundling them breaks (sequelize then looks for pg-hstore).
  serverExternalPackages: ["sequelize", "mariadb", "umzug", "sharp", "pdfkit", "nodemailer", "archiver"],
  poweredByHeader: false,
  // For profiling the bench in a browser (DEVELOPERS.md, "Profiling"): maps minified frames to source.
  productionBrowserSourceMaps: process.env.TW_SOURCE_MAPS === "1",
  reactStrictMode: true,
  typedRoutes: false,
  // Types are checked once per test run by `tsc --noEmit` (scripts/test.mjs), over the whole
  // tree including tests, so the build itself does not repeat it.
  // Next rewrites the tsconfig it is given (adding its distDir types); it gets its own file.
  typescript: { ignoreBuildErrors: true, tsconfigPath: "tsconfig.next.json" },
};

export default nextConfig;
