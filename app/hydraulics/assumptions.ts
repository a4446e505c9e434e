/**
 * Every default, margin and rule-of-thumb value the engine uses, in one place, each with
 * where it comes from. Status tags follow the shared sources note:
 * [S] seen in a stored public source, [M] from memory (verify before relying on it),
 * [CP] common practice of the trade (a configurable default, not a law), [D] derived.
 */

export interface Assumption {
  readonly value: number;
  readonly unit: string;
  readonly source: string;
}

const a = (value: number, unit: string, source: string): Assumption => ({ value, unit, source });

export const ASSUMPTIONS = {
  gravity: a(9.80665, "m/s²", "standard gravity (CGPM 1901) [D]"),

  // Efficiencies
  cylinderEfficiency: a(0.95, "-", "cylinder mechanical efficiency 0.90–0.95, seal friction; common practice [CP]"),
  volumetricEfficiency: a(0.95, "-", "pump volumetric efficiency 0.90–0.98; Esposito, Fluid Power with Applications, from memory [M]"),
  overallEfficiency: a(0.85, "-", "pump overall efficiency, gear/vane 0.80–0.90; Esposito, from memory [M]"),

  // Drive
  motorPoles: a(4, "poles", "4-pole induction motor, the usual power-unit drive; common practice [CP]"),
  ratedSpeed50Hz: a(1450, "rpm", "4-pole asynchronous speed at 50 Hz (1420–1480 with slip); common practice [CP]"),
  ratedSpeed60Hz: a(1750, "rpm", "4-pole asynchronous speed at 60 Hz (1720–1780 with slip); common practice [CP]"),

  // Lines (limits chosen inside textbook ranges)
  suctionVelocityLimit: a(1.0, "m/s", "suction 0.6–1.2 m/s (Esposito, from memory [M]); 1.0 m/s chosen, common practice [CP]"),
  returnVelocityLimit: a(3.0, "m/s", "return 2–4 m/s (Matthies/Renius, from memory [M]); 3.0 m/s chosen, common practice [CP]"),
  pressureVelocityLimit: a(5.0, "m/s", "pressure and work lines 3–6 m/s (Matthies/Renius, from memory [M]); 5.0 m/s chosen, common practice [CP]"),
  pressureLineLengthM: a(1.0, "m", "assumed pump-to-valve run inside a compact power unit; our assumption [CP]"),
  workLineLengthM: a(2.0, "m", "assumed hose run from the valve to each cylinder port; our assumption [CP]"),
  returnLineLengthM: a(1.0, "m", "assumed valve-to-tank run through the filter; our assumption [CP]"),
  suctionLineLengthM: a(0.5, "m", "assumed tank-to-pump suction run; our assumption [CP]"),
  hoseUpsizeSteps: a(
    2,
    "dash sizes",
    "hoses up to two dash sizes above the velocity-limit size (or up to the size the cylinder's lines need at the 0.5 m/s seal-speed limit, if that is more) where that saves a cylinder size step: a hose costs far less than the next cylinder, pump and motor; our rule, common practice [CP]",
  ),
  laminarReynoldsLimit: a(2000, "-", "laminar below Re ≈ 2000 (Engineering Fluid Mechanics, open textbook [S]); above it the larger Blasius factor is used"),

  // Fluid: ISO VG 46 at 40 °C
  viscosityMm2S: a(46, "mm²/s", "ISO 3448 VG 46 mid-point at 40 °C (41.4–50.6) [S]"),
  densityKgM3: a(870, "kg/m³", "mineral hydraulic oil 860–890 kg/m³; oil data sheets [M]/[CP]"),

  // Valve and filter pressure drops used to work out the pressure left at the cylinder
  dcvPathDropBar: a(5, "bar", "allowance per directional-valve path at its sized flow; common practice [CP]"),
  cbvCheckDropBar: a(3, "bar", "allowance for free flow through the counterbalance check (2→1); common practice [CP]"),
  returnFilterDropBar: a(0.5, "bar", "clean return-filter element 0.3–0.5 bar; common practice [CP]"),

  // Cylinder and buckling
  elasticModulus: a(210000, "N/mm²", "steel, EN 1993-1-1 (elastic modulus of structural steel); Roloff/Matek, from memory [M]"),
  bucklingSafetyFactor: a(3.5, "-", "hydraulics 2.5–4, ISO/TS 13725 leaves k to the designer; 3.5 chosen, common practice [CP]"),
  limitSlenderness: a(89, "-", "λ₀ for E295/E335 rod steel; Roloff/Matek, Dubbel, from memory [M]"),
  tetmajerA: a(335, "N/mm²", "Tetmajer σK = 335 − 0.62 λ for E295/E335; Roloff/Matek, Dubbel, from memory [M]"),
  tetmajerB: a(0.62, "N/mm²", "Tetmajer slope for E295/E335; Roloff/Matek, Dubbel, from memory [M]"),
  pivotLengthAtZeroStrokeMm: a(300, "mm", "pin-to-pin length at zero stroke, rear pivot + rod eye; assumed until a catalogue gives it [CP]"),
  flangeAllowanceMm: a(150, "mm", "front flange face to rod connection when retracted; assumed [CP]"),

  // Valves and settings
  reliefMargin: a(0.1, "-", "relief set about 10 % above the highest working pressure; common practice [CP]"),
  reliefRoundingBar: a(5, "bar", "relief setting rounded up to a whole 5 bar; our convention"),
  cbvMinSettingBar: a(
    20,
    "bar",
    "lowest counterbalance setting: a light load must still be held against surges and return-line back-pressure, and makers' adjustable springs start about there; common practice [CP], the spring range from memory [M]",
  ),
  cbvSettingFactor: a(1.3, "-", "counterbalance setting ≈ 1.3 × load-induced pressure (1.2–1.5); valve makers' notes, common practice [CP]"),
  valveFlowUse: a(0.8, "-", "directional valve used at ≤ 80 % of its typical maximum flow; common practice [CP]"),
  ventPressureBar: a(
    5,
    "bar",
    "pump pressure in neutral with a pilot-operated relief vented to tank by its solenoid vent valve: about 3–7 bar at rated flow in makers' curves; 5 bar chosen, common practice [CP]",
  ),
  coilVoltage: a(24, "V DC", "solenoid coil voltage, the usual machine-control supply; common practice [CP]"),
  highInertiaRatio: a(
    0.25,
    "-",
    "acceleration force ≥ 25 % of the weight component: treat as high-inertia (pilot 3:1); our rule on common-practice classes [CP]",
  ),
  stableInertiaRatio: a(0.05, "-", "acceleration force < 5 % of the weight component and no process force: stable load (pilot 8:1); our rule [CP]"),

  leakTightHoldMinutes: a(
    5,
    "min",
    "a load held at rest longer than this gets pilot-operated checks: spool valves and counterbalance valves are not leak-tight holders over minutes; the sizing contract's 'more than a few minutes', 5 min our reading [CP]",
  ),
  pocvPilotRatio: a(
    4,
    ":1",
    "pilot-operated check ratios offered 3:1 to 4.4:1; a 2:1 cylinder needs at least 3:1 on its rod end (trade text on pilot ratios [S]); 4:1 chosen [CP]",
  ),

  cushionSpeedMmS: a(100, "mm/s", "cushion the stroke end above about 0.1 m/s (20 ft/min) or with heavy loads; makers' pages, common practice [CP]"),
  cushionLengthMm: a(25, "mm", "cushion length assumed until the cylinder maker gives it; common practice [CP]"),
  pistonSpeedLimitMmS: a(500, "mm/s", "about 0.5 m/s for standard cylinders with elastomer seals, more with low-friction seals; from memory [M]"),

  effectiveBulkModulusBar: a(
    6895,
    "bar",
    "design value of 1 % volume per 1000 psi for oil with hose stretch and air (pure oil about 17 000 bar); hydraulic-maintenance article on decompression [S]",
  ),
  decompressionThresholdCm3: a(
    160,
    "cm³",
    "control the decompression when more than about 10 in³ is released; hydraulic-maintenance article on decompression [S], a trade rule",
  ),

  rmsCycleLimitS: a(
    300,
    "s",
    "RMS motor loading holds for duty cycles shorter than about 5 minutes; trade-magazine article on motor sizing for peak loads [S]",
  ),
  motorPeakSeconds: a(15, "s", "induction motors carry 60 % excess torque for 15 s (IEC 60034-1, from memory [M])"),
  unloadingMarginRatio: a(
    0.15,
    "-",
    "unloading valve of a high-low pump set 10–20 % above the highest pressure both sections must deliver at; common practice [CP]",
  ),
  unloadingMarginMinBar: a(10, "bar", "and at least 10 bar above it; common practice [CP]"),
  accumulatorMeanMargin: a(
    1.25,
    "-",
    "a pump beside an accumulator delivers 1.25 × the cycle's mean flow, so it recharges within the cycle with room for leakage; our convention [CP]",
  ),
  accumulatorMinSavingKw: a(
    3,
    "kW",
    "an accumulator is proposed only where it takes at least 3 kW off the motor's peak: it and its safety block cost about what a few kW of pump and motor do; our convention [CP]",
  ),
  accumulatorMinSteps: a(2, "-", "an accumulator is proposed only where it makes the pump at least two ISO 3662 sizes smaller; our convention [CP]"),
  accumulatorControlDropBar: a(
    10,
    "bar",
    "the lowest accumulator pressure stands this far above the highest pressure an axis needs, for its meter-in flow control to regulate; common practice [CP]",
  ),
  accumulatorBand: a(0.2, "-", "the charging valve loads the pump at p1 and unloads it at p2 = 1.2 × p1; a 10–40 % band is usual, common practice [CP]"),
  accumulatorPrechargeRatio: a(0.9, "-", "precharge p0 = 0.9 × p1 for energy storage (accumulator makers' pages) [CP]"),
  accumulatorExponent: a(1.4, "-", "n = 1.4 (nitrogen, adiabatic) for a discharge within seconds (accumulator makers' pages) [CP]"),
  doubleSmallSectionSteps: a(
    2,
    "-",
    "a double pump's small section that needs a pressing-speed control anyway may be up to two ISO 3662 sizes above its fit where that saves a size of the large section; our convention [CP]",
  ),
  unloadingBelowPressRatio: a(
    0.8,
    "-",
    "unloading setting kept clearly below the pressing pressure (at most 80 % of it, our convention), or the large section would unload too late",
  ),
  unloadedDropBar: a(
    5,
    "bar",
    "pressure across an open unloading valve and the tank line, typically 3–7 bar; a trade text cites a 70 psi (4.8 bar) vented dump [S]/[CP]",
  ),
  twoSpeedFlowRatio: a(
    3,
    "-",
    "fast-to-pressing flow ratio from which one pump for the fast flow at pressing pressure clearly over-sizes the motor (our convention, following the high-low pump argument in trade-press pump articles)",
  ),
  regenSwitchMarginRatio: a(
    0.15,
    "-",
    "pressure switch ending a regenerative approach set 10–20 % above the highest approach pressure, as for an unloading valve; common practice [CP]",
  ),
  regenSwitchMarginMinBar: a(10, "bar", "and at least 10 bar above it; common practice [CP]"),
  regenSwitchBelowPressRatio: a(
    0.8,
    "-",
    "regeneration switch kept clearly below the pressing pressure (at most 80 % of it, our convention), so the press stroke always switches to full area",
  ),
  regenMaxSpeedRatio: a(
    1.5,
    "-",
    "regeneration only where the regenerative approach runs at most 1.5 × as fast as the return on one pump flow (A3/A_rod ≤ 1.5, area ratio about 1.67 or more): with a thinner rod the pump the return needs overdrives the approach; our convention",
  ),
  compensatorLeakShare: a(0.05, "-", "standby leakage of a compensated pump ≈ (1 − η_v)·Q_max, a first estimate from memory [M]"),
  compensatorReliefGapBar: a(
    10,
    "bar",
    "relief at least about 10 bar above the compensator (p_c + 10…20 bar, or 1.1·p_c on a maker's page), so it never opens in normal work; common practice [CP]",
  ),
  flowControlMinDropBar: a(5, "bar", "a pressure-compensated flow control regulates once about 5–10 bar drops across it; 5 bar, from memory [M]"),
  motorPeakRatio: a(1.5, "× rating", "a short peak kept below 1.5 × the rated power, from the 1.6 × of IEC 60034-1 with margin [M]/[D]"),

  // Pump speed check
  speedTolerance: a(0.1, "-", "a stroke more than 10 % faster than asked is flagged; our convention"),
  pressureNearLimit: a(0.95, "-", "working pressure above 95 % of its limit leaves little reserve; our convention"),

  // Reservoir and heat
  reservoirMultiple: a(
    4,
    "× pump flow per minute",
    "stationary units 3–5 × pump flow per minute (the 3× rule in trade-press reservoir fundamentals [S]); 4× chosen, common practice [CP]",
  ),
  reservoirRoundingL: a(5, "L", "reservoir volume rounded up to a whole 5 L; our convention"),
  tankHeatTransfer: a(12, "W/(m²·K)", "tank freely surrounded by air 10–15 W/(m²·K); Matthies/Renius Tafel 8.7 [S]"),
  oilTemperatureLimit: a(60, "°C", "pump inlet temperature ≤ 60 °C; ISO 4413 as paraphrased in University of Minnesota hydraulics course notes [S]"),
  gaugeRangeFactor: a(1.5, "× relief", "gauge full scale at least 1.5 × the relief setting; common practice [CP]"),
} as const;

export type AssumptionKey = keyof typeof ASSUMPTIONS;

/** Shorthand for reading a value. */
export const A = ASSUMPTIONS;
