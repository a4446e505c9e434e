// Warnings read as a title and a sentence, never as the engine's code name.
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { WarningsList } from "~/components/design-panels";
import { WARNING_TITLES, warningTitle } from "~/content/warning-titles";
import { WARNING_CODES } from "~/hydraulics";

describe("warning titles", () => {
  it("every code the engine can raise has a short title of its own", () => {
    for (const code of WARNING_CODES) {
      expect(WARNING_TITLES[code], code).toBeTruthy();
      expect(warningTitle(code).length).toBeLessThanOrEqual(60);
    }
    expect(new Set(WARNING_CODES.map(warningTitle)).size).toBe(WARNING_CODES.length);
  });

  it("the page shows the title and the message, and keeps the code only as data", () => {
    const html = renderToStaticMarkup(<WarningsList warnings={[{ code: "HEAT_COOLER_NEEDED", message: "The tank sheds 0.4 kW; 1.2 kW must go." }]} />);
    expect(html).toContain("Cooler needed");
    expect(html).toContain("The tank sheds 0.4 kW; 1.2 kW must go.");
    expect(html).toContain('data-warning="HEAT_COOLER_NEEDED"');
    expect(html.replace(/data-warning="[^"]*"/g, "")).not.toContain("HEAT_COOLER_NEEDED");
  });
});
