import { A } from "./assumptions";
import { IEC60072_MOTOR_KW, ISO3662_DISPLACEMENTS_CC, nextInSeries } from "./series";

/** Synchronous speed n_s = 120·f / poles (electrical-machines textbooks) [D]. */
export const synchronousSpeedRpm = (supplyHz: number, poles: number): number => (120 * supplyHz) / poles;

/** Nominal 4-pole asynchronous speed used for sizing [CP]. */
export const motorSpeedRpm = (supplyHz: 50 | 60): number => (supplyHz === 50 ? A.ratedSpeed50Hz.value : A.ratedSpeed60Hz.value);

/** V_g = 1000·Q / (n·η_v), cm³/rev. */
export const requiredDisplacementCc = (flowLpm: number, speedRpm: number, volumetricEff: number): number => (1000 * flowLpm) / (speedRpm * volumetricEff);

/** Q = V_g·n·η_v / 1000, L/min. */
export const pumpDeliveryLpm = (displacementCc: number, speedRpm: number, volumetricEff: number): number => (displacementCc * speedRpm * volumetricEff) / 1000;

/** P [kW] = p [bar] · Q [L/min] / 600. */
export const hydraulicPowerKw = (pressureBar: number, flowLpm: number): number => (pressureBar * flowLpm) / 600;

/** Next ISO 3662 displacement, or the largest when the series runs out. */
export function selectDisplacementCc(requiredCc: number): { displacementCc: number; inSeries: boolean } {
  const found = nextInSeries(ISO3662_DISPLACEMENTS_CC, requiredCc);
  if (found !== undefined) return { displacementCc: found, inSeries: true };
  return { displacementCc: LARGEST_DISPLACEMENT_CC, inSeries: false };
}

const LARGEST_DISPLACEMENT_CC = ISO3662_DISPLACEMENTS_CC[ISO3662_DISPLACEMENTS_CC.length - 1];

/** Next IEC 60072-1 rated output, or the largest when the series runs out. */
export function selectMotorKw(requiredKw: number): { ratedKw: number; inSeries: boolean } {
  const found = nextInSeries(IEC60072_MOTOR_KW, requiredKw);
  if (found !== undefined) return { ratedKw: found, inSeries: true };
  return { ratedKw: IEC60072_MOTOR_KW[IEC60072_MOTOR_KW.length - 1], inSeries: false };
}
