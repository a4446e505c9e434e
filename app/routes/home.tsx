import { Link } from "react-router";
import type { Route } from "./+types/home";
import { getOptionalUser } from "~/auth/permissions.server";
import { HOME_BY_ROLE } from "~/auth/roles";
import { ButtonLink } from "~/components/ui";

export const meta: Route.MetaFunction = () => [
  { title: "Tenderflow · hydraulic axes, sized and quoted alike" },
  { name: "description", content: "Describe a hydraulic axis, get a preliminary circuit at once, and collect comparable bids from fluid-power shops." },
];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await getOptionalUser(request);
  return { home: user ? HOME_BY_ROLE[user.role] : null };
}

const STEPS = [
  { title: "Describe the axis", body: "Load, stroke, speeds, orientation and duty, in plain questions with an example beside each." },
  { title: "See the circuit at once", body: "Cylinder, pump, motor, valves, lines, reservoir and heat, with a diagram and every calculation shown." },
  { title: "Compare like with like", body: "Shops price the same bill of materials line by line, so the cheapest complete offer stands out." },
];

export default function Home({ loaderData }: Route.ComponentProps) {
  return (
    <div className="py-8">
      <section className="max-w-3xl">
        <p className="text-sm font-semibold uppercase tracking-wide text-flow-700">For machine builders and fluid-power shops</p>
        <h1 className="mt-2 text-4xl font-bold leading-tight text-ink-900">Hydraulic axes, sized and quoted alike.</h1>
        <p className="mt-4 text-lg text-ink-600">
          Tell Tenderflow what your press, lift, clamp or feed has to do. It sizes a preliminary hydraulic circuit from published engineering methods, and
          fluid-power shops bid against the same bill of materials.
        </p>
        <div className="mt-8 flex flex-wrap gap-3">
          {loaderData.home ? (
            <ButtonLink to={loaderData.home}>Go to your workspace</ButtonLink>
          ) : (
            <>
              <ButtonLink to="/sign-up">Create a free account</ButtonLink>
              <ButtonLink to="/sign-in" tone="secondary">
                Sign in
              </ButtonLink>
            </>
          )}
        </div>
      </section>
      <ol className="mt-14 grid gap-4 md:grid-cols-3">
        {STEPS.map((step, i) => (
          <li key={step.title} className="rounded-lg bg-white p-6 shadow-sm ring-1 ring-ink-100">
            <span className="flex h-8 w-8 items-center justify-center rounded-full bg-flow-100 font-bold text-flow-700">{i + 1}</span>
            <h2 className="mt-3 font-semibold">{step.title}</h2>
            <p className="mt-1 text-sm text-ink-600">{step.body}</p>
          </li>
        ))}
      </ol>
      <p className="mt-10 max-w-3xl text-sm text-ink-600">
        A preliminary circuit is a starting point for a quotation, not a design approval: every circuit needs review and sign-off by a qualified fluid-power
        engineer, and ISO 4413 and your local codes apply.{" "}
        <Link to="/sign-up" className="text-flow-700 hover:underline">
          Start with an account
        </Link>
        .
      </p>
    </div>
  );
}
