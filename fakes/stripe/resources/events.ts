// Events, read back through the API: each one the fake emitted, whether or not it was delivered.
import type { FakeEvent } from "../events";
import type { ApiRoute } from "../server";
import type { Store } from "../store";

export function eventRoutes(store: Store): ApiRoute[] {
  return [
    { method: "GET", pattern: "/v1/events/:id", handle: ({ path }) => store.get("event", path.id) },
    {
      method: "GET",
      pattern: "/v1/events",
      handle: ({ params }) => {
        params.allowOnly(["limit", "starting_after", "ending_before", "created", "type"]);
        // Stripe's type filter takes one trailing wildcard, as in `charge.*`.
        const type = params.text("type");
        const matches = (name: string) => type === undefined || (type.endsWith("*") ? name.startsWith(type.slice(0, -1)) : name === type);
        return store.list<FakeEvent>("event", "/v1/events", params, (e) => matches(e.type));
      },
    },
  ];
}
