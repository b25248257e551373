import type { NextConfig } from 'next';

const nextConfig: NextConfig = {
  // Sequelize loads its dialect packages dynamically; bundling it breaks the build.
  serverExternalPackages: ['sequelize', 'pg', 'pg-hstore', 'sharp', 'piscina', 'nodemailer'],
  poweredByHeader: false,
  typedRoutes: false,
};

export default nextConfig;
