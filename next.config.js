/**
 * Security headers on every answer: a content security policy that lets the pages load only
 * Stoke's own scripts, styles and data (Next's inline bootstrap scripts need 'unsafe-inline'; the
 * development server also needs 'unsafe-eval'), no framing by other sites, no MIME sniffing, and
 * no referrer sent to other sites.
 */
const dev = process.env.NODE_ENV !== "production";
const contentSecurityPolicy = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${dev ? " 'unsafe-eval'" : ""}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join("; ");

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Stoke runs on a user's machine or a team server with no network: nothing is fetched at
  // build or run time (no remote fonts or images).
  poweredByHeader: false,
  reactStrictMode: true,
  // Types are checked by `npm run typecheck` (run in .ci/run) over the whole project, tests
  // included; `npm start` builds without repeating that check.
  typescript: { ignoreBuildErrors: true },
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "Content-Security-Policy", value: contentSecurityPolicy },
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "Referrer-Policy", value: "same-origin" },
          { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=()" },
        ],
      },
    ];
  },
};

export default nextConfig;
