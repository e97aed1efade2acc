/**
 * Security headers for every answer. The Content-Security-Policy allows scripts only from our own
 * origin; 'unsafe-inline' stays because Next's App Router inlines its flight data in <script>
 * tags (nonces would force every page to render per request); 'unsafe-eval' only in `next dev`
 * (React's dev tooling needs it). Plotly's SVG charts need inline styles and data:/blob: images.
 */
const isDevelopment = process.env.NODE_ENV === 'development';
const contentSecurityPolicy = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${isDevelopment ? " 'unsafe-eval'" : ''}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  `connect-src 'self'${isDevelopment ? ' ws: wss:' : ''}`,
  "worker-src 'self' blob:",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

const securityHeaders = [
  { key: 'Content-Security-Policy', value: contentSecurityPolicy },
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()' },
  { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
  // Browsers ignore this over plain http (RFC 6797 §8.1), so it is safe to send always.
  { key: 'Strict-Transport-Security', value: 'max-age=31536000' },
];

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // The test script builds into its own folder so that it never clobbers a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // Server-only packages that must not be bundled (native-ish or large Node libraries).
  serverExternalPackages: ['pg', 'pg-boss', 'smtp-server', 'mailparser', 'exceljs', '@react-pdf/renderer'],
  // forbidden() / unauthorized() in pages and server actions answer 403 / 401 (server/auth).
  experimental: { authInterrupts: true },
  async headers() {
    return [{ source: '/:path*', headers: securityHeaders }];
  },
  // Browsers and feed readers that ask for /favicon.ico without reading the page's <link rel="icon">
  // get our one icon (app/icon.svg) instead of a 404.
  async redirects() {
    return [{ source: '/favicon.ico', destination: '/icon.svg', permanent: true }];
  },
};

export default nextConfig;
