import { reactRouter } from "@react-router/dev/vite";
import tailwindcss from "@tailwindcss/vite";
import { defineConfig } from "vite";

export default defineConfig({
  plugins: [tailwindcss(), reactRouter()],
  resolve: { tsconfigPaths: true },
  build: {
    rolldownOptions: {
      // The sizing engine is pure by contract (no I/O, nothing done on import), so a page that
      // uses one of its tables or schemas does not carry the rest of it.
      treeshake: { moduleSideEffects: (id: string) => !id.includes("/app/hydraulics/") },
    },
  },
  server: { host: "127.0.0.1", port: 3000 },
});
