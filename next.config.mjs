/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // The test script builds into its own folder so that it never clobbers a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // Server-only packages that must not be bundled (native-ish or large Node libraries).
  serverExternalPackages: ['pg', 'smtp-server', 'mailparser', 'exceljs', '@react-pdf/renderer'],
};

export default nextConfig;
