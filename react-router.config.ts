import type { Config } from "@react-router/dev/config";

export default {
  ssr: true,
  // Middleware on the root route checks and bounds every request in one place.
  future: { v8_middleware: true },
  // Browser tests build into their run's own folder, so they never overwrite (or race) the build
  // that `npm start` serves.
  buildDirectory: process.env.TENDERFLOW_BUILD_DIR ?? "build",
} satisfies Config;
