import { sequelize } from "~/db.server";

// GET /api/v1/health: for load balancers; answers 503 when the database does not.
export async function loader() {
  try {
    await sequelize.query("SELECT 1");
    return Response.json({ ok: true });
  } catch {
    return Response.json({ ok: false }, { status: 503 });
  }
}
