/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Server-only packages that must not be bundled (native-ish or large Node libraries).
  serverExternalPackages: ['pg', 'smtp-server', 'mailparser', 'exceljs', '@react-pdf/renderer'],
};

export default nextConfig;
