import type { NextConfig } from 'next';
import { SECURITY_HEADERS } from './lib/http/security-headers';

const nextConfig: NextConfig = {
  reactStrictMode: true,
  // The test command builds into its own folder so it never clobbers the build being served.
  distDir: process.env.KF_DIST_DIR ?? '.next',
  poweredByHeader: false,
  // Photos are resized by jimp when they are uploaded, so Next's optimiser (and sharp) is not needed.
  images: { unoptimized: true },
  // piscina starts its threads from its own files, and lib/storage/photo-worker.mjs (loaded from the
  // checkout at run time, never bundled) imports jimp and the decoders from node_modules.
  serverExternalPackages: ['pg', 'smtp-server', 'mailparser', 'bcryptjs', 'jimp', 's3rver', 'piscina'],
  async headers() {
    return [
      { source: '/:path*', headers: SECURITY_HEADERS },
      // Pages get a per-request policy with a script nonce from proxy.ts; JSON and files need none of that.
      {
        source: '/api/:path*',
        headers: [{ key: 'Content-Security-Policy', value: "default-src 'none'; frame-ancestors 'none'" }],
      },
    ];
  },
};

export default nextConfig;
