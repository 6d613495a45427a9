/**
 * Test support (not part of the engine's API): a fringe-resolved second-order interferometric autocorrelation
 * of a chirp-free Gaussian pulse, ∫ |(E(t) + E(t − τ))²|² dt with E(t) = A(t)·e^{iωt}, computed numerically.
 * Its 8 : 1 peak-to-background ratio and fringes at the optical period are the textbook signature
 * (Diels & Rudolph, Ultrashort Laser Pulse Phenomena, interferometric autocorrelation).
 */
export function interferometricTrace(pulseFwhmFs: number, centreNm: number, { stepFs = 0.1, spanFs = 3 * pulseFwhmFs } = {}): Array<[number, number]> {
  const omega = (2 * Math.PI * 299_792_458) / (centreNm * 1e-9) / 1e15; // rad per fs
  const envelope = (t: number) => Math.exp((-2 * Math.LN2 * t * t) / (pulseFwhmFs * pulseFwhmFs)); // |A|² has FWHM τ
  const dt = pulseFwhmFs / 100;
  const points: Array<[number, number]> = [];
  let background = 0;
  for (let t = -4 * pulseFwhmFs; t <= 4 * pulseFwhmFs; t += dt) background += 2 * envelope(t) ** 4;
  for (let tau = -spanFs; tau <= spanFs + 1e-9; tau += stepFs) {
    let sum = 0;
    const c = Math.cos(omega * tau);
    for (let t = -4 * pulseFwhmFs; t <= 4 * pulseFwhmFs; t += dt) {
      const a1 = envelope(t);
      const a2 = envelope(t - tau);
      const field = a1 * a1 + a2 * a2 + 2 * a1 * a2 * c;
      sum += field * field;
    }
    points.push([Number(tau.toFixed(4)), sum / background]);
  }
  return points;
}
