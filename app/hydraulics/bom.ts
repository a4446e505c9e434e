import type { BomLine, Design } from "./design";
import { num } from "./format";
import { SAE_J517_HOSES } from "./series";

type Line = Design["lines"]["pressure"];

/** Oil held by a hose, L. */
const hoseVolume = (line: Line): number => (((Math.PI * line.innerDiameterMm ** 2) / 4) * line.lengthM) / 1000;

/** The size part of a hose specification depends only on the dash size: written once per size. */
const HOSE_TEXT = SAE_J517_HOSES.map((h) => `SAE J517 -${h.dash} (${h.inch} in, DN ${h.dn}, ${num(h.nominalIdMm, 2)} mm bore), about `);

function hose(key: string, item: string, line: Line, rated: string): BomLine {
  const size =
    SAE_J517_HOSES[line.hoseIndex]?.nominalIdMm === line.innerDiameterMm && SAE_J517_HOSES[line.hoseIndex].dash === line.dashSize
      ? HOSE_TEXT[line.hoseIndex]
      : `SAE J517 -${line.dashSize} (${line.nominalInch} in, DN ${line.dn}, ${num(line.innerDiameterMm, 2)} mm bore), about `;
  return {
    key,
    item,
    quantity: 1,
    specification: `${size}${num(line.lengthM, 2)} m, ${rated}`,
    rating: { value: line.innerDiameterMm, unit: "mm", label: "inner diameter" },
  };
}

/** One line per component, with stable keys the bids and exports are keyed on. */
export function buildBom(d: Design, gaugeRangeBar: number): BomLine[] {
  const relief = d.pressuresBar.reliefSetting;
  const vent = d.reliefVent;
  const pumpLpm = num(d.flowsLpm.pump);
  const motorKw = num(d.motor.ratedKw, 2);
  const c = d.cylinder;
  const torqueNm = (9550 * d.motor.ratedKw) / d.pump.speedRpm;
  const l = d.lines;
  const hoseVolumeL = hoseVolume(l.pressure) + hoseVolume(l.capWork) + hoseVolume(l.rodWork) + hoseVolume(l.return) + hoseVolume(l.suction);
  const fillL = Math.ceil(d.reservoir.volumeL + (c.capAreaMm2 * c.strokeMm) / 1e6 + hoseVolumeL);
  const pressureHose = `rated for at least ${relief} bar working pressure with the burst margin its standard requires`;

  const bom: BomLine[] = [
    pumpLine(d, pumpLpm, relief),
    {
      key: "motor",
      item: "Electric motor, 4-pole, foot/flange",
      quantity: 1,
      specification: `${motorKw} kW (IEC 60072-1 rating)${d.motor.frame ? `, frame ${d.motor.frame}` : ""}, ${d.requirements.supplyHz} Hz, about ${d.pump.speedRpm} rpm`,
      rating: { value: d.motor.ratedKw, unit: "kW", label: "rated output" },
    },
    {
      key: "coupling-bellhousing",
      item: "Bell housing and flexible coupling",
      quantity: 1,
      specification: `joins the ${motorKw} kW motor${d.motor.frame ? ` (frame ${d.motor.frame})` : ""} to the pump flange; coupling for at least ${num(torqueNm)} N·m`,
      rating: { value: torqueNm, unit: "N·m", label: "coupling torque" },
    },
    {
      key: "reservoir",
      item: "Reservoir",
      quantity: 1,
      specification: `${d.reservoir.volumeL} L usable, baffle between return and suction, return below the minimum oil level, level and temperature gauge, breather`,
      rating: { value: d.reservoir.volumeL, unit: "L", label: "usable volume" },
    },
    {
      key: "suction-strainer",
      item: "Suction strainer",
      quantity: 1,
      specification: `for ${pumpLpm} L/min with low pressure drop; mesh as the pump maker allows`,
      rating: { value: d.flowsLpm.pump, unit: "L/min", label: "flow" },
    },
    {
      key: "return-filter",
      item: "Return-line filter",
      quantity: 1,
      specification: `for ${num(d.returnFilter.ratedFlowLpm)} L/min at ISO VG 46, about 10 µm absolute, bypass valve about 2.5 bar, clogging indicator`,
      rating: { value: d.returnFilter.ratedFlowLpm, unit: "L/min", label: "rated flow" },
    },
    vent
      ? {
          key: "relief-valve",
          item: "Pressure-relief valve, pilot-operated, with vent port X",
          quantity: 1,
          specification: `set to ${relief} bar, passes the full ${pumpLpm} L/min; vented through port X by the relief vent valve (about ${num(vent.ventPressureBar)} bar at the pump in neutral)`,
          rating: { value: relief, unit: "bar", label: "setting" },
        }
      : {
          key: "relief-valve",
          item: "Pressure-relief valve",
          quantity: 1,
          specification: `set to ${relief} bar, passes the full ${pumpLpm} L/min`,
          rating: { value: relief, unit: "bar", label: "setting" },
        },
    {
      key: "directional-valve",
      item: "4/3 solenoid directional valve",
      quantity: 1,
      specification: `ISO 4401-${d.directionalValve.iso4401Size} (${d.directionalValve.nominalSize}), ${d.directionalValve.center} centre, ${d.directionalValve.coilVoltage} coils, at least ${num(d.directionalValve.maxPathFlowLpm)} L/min per path and ${relief} bar`,
      rating: { value: d.directionalValve.maxPathFlowLpm, unit: "L/min", label: "largest path flow" },
    },
  ];
  if (d.cooler) {
    bom.push({
      key: "cooler",
      item: "Oil cooler (air blast), in the return line",
      quantity: 1,
      specification: `sheds at least ${num(Math.ceil(d.cooler.kw * 10) / 10)} kW with the oil at 60 °C and ${num(d.requirements.ambientC)} °C air, for ${num(d.returnFilter.ratedFlowLpm)} L/min return flow, with a bypass check valve about 2 bar`,
      rating: { value: d.cooler.kw, unit: "kW", label: "heat rejection" },
    });
  }
  // A line of its own (not folded into the relief's): the vent valve is a separate part with its
  // own coil and wiring, often mounted on the relief or supplied with it as a solenoid-vented relief.
  if (vent) {
    bom.push({
      key: "relief-vent-valve",
      item: "Relief vent valve, 2/2 solenoid, normally open",
      quantity: 1,
      specification: `on the relief valve's vent port X to tank, ${vent.coilVoltage} coil; de-energised in neutral (the pump circulates at about ${num(vent.ventPressureBar)} bar), energised with solenoid a or b; rated for at least ${relief} bar`,
      rating: { value: relief, unit: "bar", label: "pressure rating" },
    });
  }
  if (d.decompression.needed) {
    bom.push({
      key: "decompression-valve",
      item: "Decompression valve for the cap line",
      quantity: 1,
      specification: `releases about ${Math.round(d.decompression.releaseCm3)} cm³ from the cap end (${num(d.decompression.pressureBar)} bar) to tank through an orifice before the return stroke starts; the controls hold the return until the cap pressure has fallen`,
      rating: { value: d.decompression.releaseCm3, unit: "cm³", label: "volume released" },
    });
  }
  if (d.holding) {
    const h = d.holding;
    const where = h.side === "both" ? "one on each cylinder port" : `on the ${h.side} port`;
    bom.push({
      key: "holding-valve",
      item: "Pilot-operated check valve (leak-tight load holding)",
      quantity: h.side === "both" ? 2 : 1,
      specification: `poppet type, ${where}, pilot ratio ${num(h.pilotRatio, 2)}:1, opens at about ${num(h.pilotOpeningBar)} bar pilot, at least ${num(h.flowLpm)} L/min and ${relief} bar, externally drained if the return line carries back-pressure; flange-mounted directly on the cylinder`,
      rating: { value: h.pilotRatio, unit: ":1", label: "pilot ratio" },
    });
  }
  if (d.counterbalance) {
    const cb = d.counterbalance;
    bom.push({
      key: "counterbalance-valve",
      item: "Counterbalance valve",
      quantity: 1,
      specification: `on the ${cb.side} port, set to ${num(cb.settingBar)} bar, pilot ratio ${num(cb.pilotRatio, 2)}:1, at least ${num(cb.flowLpm)} L/min, flange-mounted directly on the cylinder port`,
      rating: { value: cb.settingBar, unit: "bar", label: "setting" },
    });
  }
  const cushions = [c.cushioning.extend.cushioned ? "extended" : "", c.cushioning.retract.cushioned ? "retracted" : ""].filter(Boolean);
  const cushionText = cushions.length === 2 ? ", cushioned at both ends" : cushions.length === 1 ? `, cushioned at the ${cushions[0]} end` : "";
  bom.push(
    {
      key: "cylinder",
      item: "Double-acting hydraulic cylinder",
      quantity: 1,
      specification: `bore ${num(c.boreMm, 2)} mm / rod ${num(c.rodMm, 2)} mm (ISO 3320), stroke ${num(c.strokeMm, 2)} mm, ${c.series} style, ${d.requirements.mountingStyle ? `${d.requirements.mountingStyle} mounting, ` : ""}rod end ${d.requirements.mounting}, rated ${c.ratedPressureBar} bar${cushionText}`,
      rating: { value: c.boreMm, unit: "mm", label: "bore" },
    },
    hose("hose-pressure", "Pressure hose, pump to valve", d.lines.pressure, pressureHose),
    hose("hose-cap", "Work hose, valve A to cap end", d.lines.capWork, pressureHose),
    hose("hose-rod", "Work hose, valve B to rod end", d.lines.rodWork, pressureHose),
    hose("hose-return", "Return hose, valve T to filter and tank", d.lines.return, "low-pressure return hose"),
    hose("hose-suction", "Suction hose, tank to pump", d.lines.suction, "suction hose that will not collapse under vacuum"),
    {
      key: "gauge",
      item: "Pressure gauge with isolator",
      quantity: 1,
      specification: `0–${gaugeRangeBar} bar, liquid-filled, on the pump line`,
      rating: { value: gaugeRangeBar, unit: "bar", label: "full scale" },
    },
    {
      key: "fluid-fill",
      item: "Hydraulic oil ISO VG 46 (first fill)",
      quantity: 1,
      specification: `about ${fillL} L: reservoir, cylinder and hoses`,
      rating: { value: fillL, unit: "L", label: "volume" },
    },
  );
  bom.push(...regenerationLines(d, relief));
  if (d.pump.type === "double" && d.pump.unloadingBar !== undefined) {
    const [large] = d.pump.displacementsCcRev;
    const largeLpm = (large * d.pump.speedRpm * d.pump.volumetricEfficiency) / 1000;
    bom.push(
      {
        key: "unloading-valve",
        item: "Unloading valve, externally piloted from the system line",
        quantity: 1,
        specification: `on the large pump section's outlet, set to ${num(d.pump.unloadingBar)} bar, dumps ${num(largeLpm)} L/min to tank at about ${num(d.pump.unloadedDropBar ?? 0)} bar once the pressing pressure builds`,
        rating: { value: d.pump.unloadingBar, unit: "bar", label: "setting" },
      },
      {
        key: "pump-check-valve",
        item: "Check valve, large pump section to system",
        quantity: 1,
        specification: `passes ${num(largeLpm)} L/min into the system line and keeps the small section's flow from escaping through the unloading valve; rated for at least ${relief} bar`,
        rating: { value: largeLpm, unit: "L/min", label: "flow" },
      },
    );
  }
  if (d.pressSpeedControl) bom.push(...pressSpeedLines(d, relief));
  return bom;
}

/** The meter-in flow control that sets the pressing speed, its approach bypass and the switch that changes over. */
function pressSpeedLines(d: Design, relief: number): BomLine[] {
  const pc = d.pressSpeedControl!;
  const speed = d.requirements.pressSpeedMmS;
  return [
    {
      key: "press-flow-control",
      item: "Flow control valve, pressure-compensated, with reverse free-flow check",
      quantity: 1,
      specification: `meter-in, in the cap line between valve port A and the cylinder: set to ${num(pc.settingLpm, 2)} L/min${speed !== undefined ? ` (pressing at ${num(speed)} mm/s)` : ""}, controlled range reaching at least that, needs about ${num(pc.minDropBar)} bar across it to regulate; the check passes ${num(pc.returnFlowLpm)} L/min back from the cap end on the return; rated for at least ${relief} bar. Never in the rod-end line`,
      rating: { value: pc.settingLpm, unit: "L/min", label: "setting" },
    },
    {
      key: "press-bypass-valve",
      item: "Bypass valve, 2/2 solenoid, normally closed, poppet type",
      quantity: 1,
      specification: `across the flow control: energised for the approach (passes ${num(pc.bypassFlowLpm)} L/min), de-energised where the pressing stroke starts, so a lost signal leaves the rod at pressing speed; ${d.directionalValve.coilVoltage} coil, rated for at least ${relief} bar`,
      rating: { value: pc.bypassFlowLpm, unit: "L/min", label: "flow" },
    },
    {
      key: "press-limit-switch",
      item: "Limit switch (or inductive proximity switch), start of the pressing stroke",
      quantity: 1,
      specification: `adjustable on the axis, ${num(d.requirements.pressStrokeMm)} mm before the end of the extension; switches the bypass valve off so the flow control takes over`,
      rating: { value: d.requirements.pressStrokeMm, unit: "mm", label: "pressing stroke" },
    },
  ];
}

/**
 * A regenerative approach: the valve that leads the rod end's outflow into the cap line and,
 * before a pressing force, the pressure switch that ends it. A 3/2 function, since the rod end
 * must also be shut off from valve port B (and so from tank) while it regenerates.
 */
function regenerationLines(d: Design, relief: number): BomLine[] {
  const rg = d.regeneration;
  if (!rg) return [];
  const dv = d.directionalValve;
  const ratedLpm = Math.max(rg.rodOutflowLpm, d.flowsLpm.pump);
  const when =
    rg.endsBy === "pressure-switch"
      ? "energised with solenoid a for the approach and de-energised by the pressure switch, so the pressing force is built on the full area"
      : rg.endsBy === "limit-switch"
        ? `energised with solenoid a for the approach and de-energised by the limit switch where the pressing stroke starts${d.pressSpeedControl ? " (the one that also ends the flow control's bypass)" : ""}, so the pressing is done on the full area`
        : "energised with solenoid a for the whole extension";
  const lines: BomLine[] = [
    {
      key: "regeneration-valve",
      item: "Regeneration valve, 3/2 solenoid, in the rod line at the valve stack",
      quantity: 1,
      specification: `de-energised joins the rod end to valve port B (normal work); energised joins it to the cap line with port B closed, so the rod end's ${num(rg.rodOutflowLpm)} L/min joins the pump flow and ${num(rg.capInflowLpm)} L/min enter the cap end; ${when}; ISO 4401-${dv.iso4401Size} interface as the directional valve (sandwich plate or own subplate), at least ${num(ratedLpm)} L/min and ${relief} bar, ${dv.coilVoltage} coil`,
      rating: { value: ratedLpm, unit: "L/min", label: "rated flow" },
    },
  ];
  // With a pressing stroke the limit switch of the pressing-speed control ends it; without one, its own.
  if (rg.endsBy === "limit-switch" && !d.pressSpeedControl) {
    lines.push({
      key: "regeneration-limit-switch",
      item: "Limit switch (or inductive proximity switch), end of the regenerative approach",
      quantity: 1,
      specification: `adjustable on the axis, ${num(d.requirements.pressStrokeMm)} mm before the end of the extension; de-energises the regeneration valve so the pressing stroke runs on the full area`,
      rating: { value: d.requirements.pressStrokeMm, unit: "mm", label: "pressing stroke" },
    });
  }
  if (rg.switchBar !== null) {
    lines.push({
      key: "regeneration-pressure-switch",
      item: "Pressure switch on the cap line (ends the regenerative approach)",
      quantity: 1,
      specification: `trips at ${num(rg.switchBar)} bar rising, adjustable range covering it, rated for at least ${relief} bar; its contact de-energises the regeneration valve when the tool meets the work, and the control latches it until the return stroke (the pressure drops once the full area takes the force); ${dv.coilVoltage} control input`,
      rating: { value: rg.switchBar, unit: "bar", label: "setting" },
    });
  }
  return lines;
}

/** The pump line names the kind of pump and every setting a shop must quote it with. */
function pumpLine(d: Design, pumpLpm: string, relief: number): BomLine {
  const p = d.pump;
  const rating = { value: p.displacementCcRev, unit: "cm³/rev", label: "displacement" };
  if (p.type === "double") {
    const [large, small] = p.displacementsCcRev;
    return {
      key: "pump",
      item: "Double (high-low) pump",
      quantity: 1,
      rating,
      specification: `large section ${num(large, 2)} and small section ${num(small, 2)} cm³/rev on one shaft, ${p.speedRpm} rpm, together ${pumpLpm} L/min; the small section rated for at least ${relief} bar, the large one for at least ${num(p.unloadingBar ?? 0)} bar`,
    };
  }
  if (p.type === "compensated") {
    const limiter = p.powerLimitKw !== undefined ? `, power limiter set to ${num(p.powerLimitKw, 2)} kW shaft power` : "";
    return {
      key: "pump",
      item: "Pressure-compensated variable-displacement pump",
      quantity: 1,
      rating,
      specification: `${num(p.displacementCcRev, 2)} cm³/rev at full stroke, ${p.speedRpm} rpm, up to ${pumpLpm} L/min, compensator set to ${num(p.compensatorBar ?? 0)} bar${limiter}, rated for at least ${relief} bar`,
    };
  }
  return {
    key: "pump",
    item: "Fixed-displacement pump",
    quantity: 1,
    rating,
    specification: `${num(p.displacementCcRev, 2)} cm³/rev (ISO 3662 series), ${p.speedRpm} rpm, delivers ${pumpLpm} L/min, rated for at least ${relief} bar`,
  };
}
