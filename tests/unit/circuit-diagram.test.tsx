import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { CircuitDiagram } from "~/components/circuit-diagram";
import { sizeCircuit, type Design } from "~/hydraulics/index";
import { dcvPositions } from "~/hydraulics/valves";

// Three axes that exercise the three circuit shapes: no counterbalance valve, one on the rod
// side (the load pulls the rod out), one on the cap side (the load pushes the rod in).
const duty = { strokeMm: 400, extendSpeedMmS: 100, retractSpeedMmS: 150, mounting: "fixed-pinned", cyclesPerHour: 60, hoursPerDay: 8, supplyHz: 50 } as const;
const feed = sizeCircuit({ ...duty, orientation: "horizontal", massKg: 800, processForceN: 20000 });
const press = sizeCircuit({ ...duty, orientation: "vertical", rodDirection: "down", massKg: 1200, processForceN: 60000 });
const lift = sizeCircuit({ ...duty, orientation: "inclined", inclineDeg: 35, rodDirection: "up", massKg: 2000 });

const render = (design: Design, units?: "metric" | "us") => renderToStaticMarkup(<CircuitDiagram design={design} units={units} />);
const attrs = (html: string, selector: RegExp) => [...html.matchAll(selector)];

/** The attributes of the position box of the 4/3 valve, e.g. { paths: "A-T,B-T", blocked: "P" }. */
function positionBox(html: string, position: "left" | "center" | "right") {
  const m = html.match(new RegExp(`data-position="${position}" data-paths="([^"]*)" data-blocked="([^"]*)"`));
  if (!m) throw new Error(`no ${position} box`);
  return { paths: m[1], blocked: m[2] };
}

/** A copy of a design with another centre condition, to check the drawing follows the data. */
const withCentre = (design: Design, center: "closed" | "open"): Design => ({
  ...design,
  circuit: { ...design.circuit, dcvPositions: dcvPositions(center) },
});

describe("CircuitDiagram", () => {
  it("is an accessible SVG whose title and description summarise the circuit", () => {
    const html = render(press);
    expect(html).toMatch(/^<svg[^>]+role="img"/);
    expect(html).toMatch(/viewBox="0 0 \d+ \d+"/);
    const [, labelledBy] = html.match(/aria-labelledby="([^"]+)"/)!;
    for (const id of labelledBy.split(" ")) expect(html).toContain(`id="${id}"`);
    expect(html).toMatch(/<title[^>]*>Preliminary hydraulic circuit: float centre 4\/3 valve with a counterbalance valve<\/title>/);
    const desc = html.match(/<desc[^>]*>(.*?)<\/desc>/)![1];
    expect(desc).toContain(`Counterbalance valve on the rod side set to ${Math.round(press.counterbalance!.settingBar)} bar with pilot ratio 3:1`);
    expect(desc).toContain("In neutral it joins A to T and B to T; P is blocked");
    expect(desc).toContain(`Relief valve set to ${press.pressuresBar.reliefSetting} bar`);
  });

  it("draws no counterbalance valve, and no ports 1, 2, 3, when the design has none", () => {
    expect(feed.counterbalance).toBeNull();
    const html = render(feed);
    expect(html).not.toContain('data-kind="cbv"');
    expect(html).not.toMatch(/data-port="[^"]*\.[123]"/);
    expect(html).not.toContain('data-line="pilot"');
    expect(html).toContain("without a counterbalance valve");
  });

  it("draws the counterbalance valve with ports 1, 2, 3 and a dashed pilot to the opposite work line", () => {
    for (const [design, pilotFrom] of [[press, "dcv.A"], [lift, "dcv.B"]] as const) {
      const html = render(design);
      expect(html).toContain('data-component="cbv" data-kind="cbv"');
      for (const port of ["1", "2", "3"]) expect(html).toMatch(new RegExp(`data-port="cbv\\.${port}"[^>]*>${port}<`));
      const pilot = html.match(/<path[^>]*data-line="pilot"[^>]*>/)![0];
      expect(pilot).toContain(`data-from="${pilotFrom}"`);
      expect(pilot).toContain('data-to="cbv.3"');
      expect(pilot).toMatch(/stroke-dasharray="[\d.]+ [\d.]+"/);
    }
  });

  it("puts the valve on the side the data names: rod side for the press, cap side for the lift", () => {
    expect(render(press)).toMatch(/data-from="cbv.1" data-to="cylinder.rod"/);
    expect(render(lift)).toMatch(/data-from="cbv.1" data-to="cylinder.cap"/);
  });

  it("draws every connection of the circuit as a path between its two ports", () => {
    for (const design of [feed, press, lift]) {
      const html = render(design);
      const drawn = attrs(html, /<path[^>]*data-from="([^"]+)" data-to="([^"]+)" data-line="([^"]+)"/g).map((m) => `${m[1]}>${m[2]}:${m[3]}`);
      const expected = design.circuit.connections.map((c) => `${c.from}>${c.to}:${c.line}`);
      expect(drawn.sort()).toEqual(expected.sort());
    }
  });

  it("draws a tank symbol at each line that ends at the reservoir", () => {
    const html = render(feed);
    const toTank = feed.circuit.connections.filter((c) => c.from.startsWith("tank.") || c.to.startsWith("tank.")).length;
    expect(attrs(html, /data-kind="tank"/g)).toHaveLength(toTank);
  });

  it("draws the float centre with A and B to T and P blocked (T-stop)", () => {
    const html = render(press);
    expect(positionBox(html, "center")).toEqual({ paths: "A-T,B-T", blocked: "P" });
    expect(html).toMatch(/data-position="center"[^>]*>(?:(?!data-position).)*data-blocked-port="P"/);
  });

  it("draws the tandem centre with P to T and A, B blocked", () => {
    const html = render(feed);
    expect(positionBox(html, "center")).toEqual({ paths: "P-T", blocked: "A,B" });
  });

  it("follows the centre condition in the data, whatever it is", () => {
    expect(positionBox(render(withCentre(feed, "closed")), "center")).toEqual({ paths: "", blocked: "P,T,A,B" });
    expect(positionBox(render(withCentre(feed, "open")), "center")).toEqual({ paths: "P-T,A-T,B-T", blocked: "" });
  });

  it("draws the shifted positions as parallel (P→A, B→T) and crossed (P→B, A→T) flow", () => {
    const html = render(press);
    expect(positionBox(html, "left")).toEqual({ paths: "P-A,B-T", blocked: "" });
    expect(positionBox(html, "right")).toEqual({ paths: "P-B,A-T", blocked: "" });
  });

  it("labels the valve ports P, T, A, B and the cylinder's cap and rod ports", () => {
    const html = render(feed);
    for (const port of ["P", "T", "A", "B"]) expect(html).toMatch(new RegExp(`data-port="dcv\\.${port}"[^>]*>${port}<`));
    expect(html).toMatch(/data-port="cylinder.cap"[^>]*>cap</);
    expect(html).toMatch(/data-port="cylinder.rod"[^>]*>rod</);
  });

  it("draws the solenoid vent valve beside a relief that the data vents: dashed from port X, solid to its own tank", () => {
    // Float centre blocks P, so the engine vents the relief (common practice); the drawing follows the data.
    for (const design of [press, lift]) {
      const vent = design.circuit.components.find((c) => c.kind === "vent")!;
      expect(vent.ports).toEqual(["P", "T"]);
      const html = render(design);
      expect(html).toContain('data-component="vent" data-kind="vent"');
      for (const port of ["P", "T"]) expect(html).toMatch(new RegExp(`data-port="vent\\.${port}"[^>]*>${port}<`));
      expect(html).toMatch(/data-port="relief\.X"[^>]*>X</);
      // ISO 1219-1 style 2/2: a solenoid, a return spring, the normal box open P-T, the energised box blocking both
      const symbol = html.match(/<g data-component="vent" data-kind="vent">(.*?)<\/g><text/)![1];
      expect(symbol).toContain('data-actuator="solenoid"');
      expect(symbol).toMatch(/data-position="normal" data-paths="P-T" data-blocked=""/);
      expect(symbol).toMatch(/data-position="energised" data-paths="" data-blocked="P,T"/);
      expect(symbol).toMatch(/<polyline[^>]*points="[^"]+"/); // the spring
      const ventLine = html.match(/<path[^>]*data-from="relief.X"[^>]*>/)![0];
      expect(ventLine).toContain('data-to="vent.P"');
      expect(ventLine).toContain('data-line="pilot"');
      expect(ventLine).toMatch(/stroke-dasharray="[\d.]+ [\d.]+"/);
      const toTank = html.match(/<path[^>]*data-from="vent.T"[^>]*>/)![0];
      expect(toTank).toContain('data-to="tank.return"');
      expect(toTank).not.toContain("stroke-dasharray");
      // a tank symbol under the vent valve's T line, at its x
      const tx = Number(toTank.match(/d="M([\d.]+) /)![1]);
      expect(html).toMatch(new RegExp(`data-kind="tank"><polyline points="${tx - 20},`));
      expect(html).toContain("Vent valve");
      expect(html).toContain("2/2, normally open");
      expect(html).toContain(`vents at ${design.reliefVent!.ventPressureBar} bar`);
      const desc = html.match(/<desc[^>]*>(.*?)<\/desc>/)![1];
      expect(desc).toContain("Normally open 2/2 solenoid vent valve on the relief&#x27;s vent port X");
    }
  });

  it("draws no vent valve and no port X when the centre unloads the pump (tandem)", () => {
    expect(feed.reliefVent).toBeNull();
    const html = render(feed);
    expect(html).not.toContain('data-kind="vent"');
    expect(html).not.toContain('data-port="relief.X"');
    expect(html).not.toContain("Vent valve");
  });

  it("shows the sized values beside the symbols", () => {
    const html = render(press);
    const { boreMm, rodMm, strokeMm } = press.cylinder;
    expect(html).toContain(`Ø${boreMm} / Ø${rodMm} × ${strokeMm} mm`);
    expect(html).toContain(`set ${press.pressuresBar.reliefSetting} bar`);
    expect(html).toContain(`ISO 4401-${press.directionalValve.iso4401Size}`);
    expect(html).toContain("float centre");
    expect(html).toContain(`${press.pump.displacementCcRev} cm³/rev`);
    expect(html).toContain(`${press.motor.ratedKw} kW`);
    expect(html).toContain("pilot ratio 3:1");
  });

  it("shows US customary values when asked (1 bar = 14.5038 psi, 1 in = 25.4 mm)", () => {
    const html = render(press, "us");
    const psi = Math.round(press.pressuresBar.reliefSetting * 14.5038).toLocaleString("en-GB");
    expect(html).toContain(`set ${psi} psi`);
    expect(html).toContain(`Ø${(press.cylinder.boreMm / 25.4).toFixed(2)} /`);
    expect(html).toContain("gpm");
    expect(html).not.toContain(" bar<");
  });

  it("leaves out a component the circuit does not list, with its lines", () => {
    const noGauge: Design = {
      ...feed,
      circuit: {
        ...feed.circuit,
        components: feed.circuit.components.filter((c) => c.kind !== "gauge"),
        connections: feed.circuit.connections.filter((c) => !c.to.startsWith("gauge.")),
      },
    };
    const html = render(noGauge);
    expect(html).not.toContain('data-kind="gauge"');
    expect(html).not.toContain('data-to="gauge.port"');
    expect(html).toContain('data-kind="pump"');
  });
});
