import { renderToStaticMarkup } from "react-dom/server";
import { createRoutesStub } from "react-router";

/**
 * A report's markup as a page draws it on the server, inside a router at `address`: its folded
 * bill and trail are drawn only when the address asks for them (`?show=bill&show=calculation-trail`,
 * as the link a browser without JavaScript follows).
 */
export function reportPage(report: React.ReactElement, address = "/") {
  const Page = createRoutesStub([{ path: "*", Component: () => report }]);
  return renderToStaticMarkup(<Page initialEntries={[address]} />);
}

/** The address that draws both folded sections open. */
export const UNFOLDED = "/?show=bill&show=calculation-trail";
