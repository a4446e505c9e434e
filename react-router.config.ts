import type { Config } from "@react-router/dev/config";

export default {
  ssr: true,
  // Browser tests build into their run's own folder, so they never overwrite (or race) the build
  // that `npm start` serves.
  buildDirectory: process.env.TENDERFLOW_BUILD_DIR ?? "build",
} satisfies Config;
