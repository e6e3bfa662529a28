/** @type {import('next').NextConfig} */
const nextConfig = {
  // These packages load drivers and migrations dynamically; bundling them breaks (see STACK.md).
  serverExternalPackages: ["sequelize", "mariadb", "umzug", "sharp", "@react-pdf/renderer", "nodemailer"],
  poweredByHeader: false,
  reactStrictMode: true,
  typedRoutes: false,
};

export default nextConfig;
