/**
 * Oil compressed in the cap end at the end of the extension expands when the valve shifts to
 * return: ΔV = V·Δp / K. Trade texts design with about 1 % per 1000 psi (K_eff ≈ 6895 bar, for
 * hose and tube stretch and entrained air) and control the release above about 10 in³ (160 cm³);
 * skipped, the shock breaks pipes and hoses over time (trade-press hydraulics chapters and a
 * hydraulic-maintenance article on decompression) [S].
 */
import { A } from "./assumptions";

export interface Decompression {
  /** oil under pressure: the cap end at full stroke and its work line */
  compressedVolumeL: number;
  pressureBar: number;
  /** volume the oil gives back when the pressure is released, cm³ */
  releaseCm3: number;
  /** the release exceeds the threshold: a decompression valve lets it out before the return */
  needed: boolean;
}

export const releaseCm3 = (volumeL: number, pressureBar: number): number => (volumeL * 1000 * pressureBar) / A.effectiveBulkModulusBar.value;

export function decompressionFor(volumeL: number, pressureBar: number): Decompression {
  const release = releaseCm3(volumeL, pressureBar);
  return { compressedVolumeL: volumeL, pressureBar, releaseCm3: release, needed: release > A.decompressionThresholdCm3.value };
}
