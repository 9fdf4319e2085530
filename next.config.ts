import type { NextConfig } from "next";

/** The app's pages load nothing from other origins. */
const APP_CSP = {
    key: "Content-Security-Policy",
    value: [
      "default-src 'self'",
      "script-src 'self' 'unsafe-inline'",
      "style-src 'self' 'unsafe-inline'",
      "img-src 'self' data: blob:",
      "font-src 'self'",
      "connect-src 'self'",
      "frame-ancestors 'none'",
      "base-uri 'self'",
      "form-action 'self'",
      "object-src 'none'",
    ].join("; "),
};

/**
 * Files people uploaded (attachments) are served under a policy that lets them run nothing and
 * load nothing, whatever they contain; the route sets the same, and this keeps the app's policy
 * from replacing it.
 */
const FILE_CSP = { key: "Content-Security-Policy", value: "default-src 'none'; frame-ancestors 'none'; sandbox" };

const commonHeaders = [
  { key: "X-Frame-Options", value: "DENY" },
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=()" },
];

const nextConfig: NextConfig = {
  poweredByHeader: false,
  // npm test builds into its own folder so a running development server keeps its build.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  typedRoutes: false,
  async headers() {
    return [
      { source: "/((?!api/v1/attachments/).*)", headers: [APP_CSP, ...commonHeaders] },
      { source: "/api/v1/attachments/:path*", headers: [FILE_CSP, ...commonHeaders] },
    ];
  },
};

export default nextConfig;
