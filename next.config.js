/** @type {import('next').NextConfig} */
const nextConfig = {
  // Stoke runs on a user's machine or a team server with no network: nothing is fetched at
  // build or run time.
  poweredByHeader: false,
  reactStrictMode: true,
  typedRoutes: false,
};

export default nextConfig;
