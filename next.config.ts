import type { NextConfig } from 'next';

import { securityHeaders } from './lib/security-headers';

const nextConfig: NextConfig = {
  // A second build folder lets a developer build while another build is being served.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  serverExternalPackages: ['sequelize', 'pg', 'pg-hstore', 'sharp', 's3rver', 'rate-limiter-flexible', 'piscina'],
  poweredByHeader: false,
  async headers() {
    return [{ source: '/:path*', headers: securityHeaders() }];
  },
};

export default nextConfig;
