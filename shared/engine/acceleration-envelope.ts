/**
 * The envelope peak of the structure's acceleration for one structure mode with n TMDs at the same point (1 + n DOF)
 * under a load given as force-frequency bands: max over the bands and their force frequencies f of
 * ω² |X_s / F|(f) · F(f), the continuous maximum. This is the hot kernel behind `assess`, `size` and the robustness
 * map (docs/engine.md, "Speed").
 *
 * Method (the same as the envelope search of loads/response-envelope.ts, made fast): each band is sampled on a
 * uniform grid of 48 intervals merged with the coupled undamped natural frequencies and the kinks of F; every sampled
 * local maximum of at least half the largest sample is polished by Brent's method (parabolic steps, golden-section
 * fall-back; Brent 1973), started from the parabola through the three samples around it and stopped when the next
 * parabola promises less than 1e-13 more or its vertex moves by less than 1e-9 of the frequency. A sample at a kink
 * of F or a band end is probed 1e-9 to either side first: where neither side rises the sample itself is the maximum
 * there; otherwise only the rising side is polished.
 *
 * Speed comes from three things. (1) The squared magnitude g = (ω² F)² / |D|² is maximised (no square root per
 * point; D is the structure's dynamic stiffness of response.ts). (2) Everything at the grid points that does not
 * depend on the dampers' damping (ω² F, K − ω² M, ω C, m_j ω², k_j − m_j ω², ω c_j) is computed once per system and
 * kept in Float64Arrays (for one damper, six numbers a point give g for any scale s of the damping in about 12 flops
 * and one division); `peak(dampingScale)` then scales the dampers' damping coefficients, and `peaks(scales)` samples
 * a whole row of the robustness map in one loop before polishing each cell. (3) Nothing is allocated per call or per
 * point.
 */

import type { ForceBand } from './loads/response-envelope';
import type { ModeTmdSystem } from './response';

const TWO_PI = 2 * Math.PI;
/** Uniform intervals per band (the same grid as loads/response-envelope.ts's maximiseContinuous). */
export const ENVELOPE_SAMPLES = 48;
/** Brent's relative tolerance on the peak frequency (the value is then exact to about 1e-15 relative at a smooth peak). */
const POLISH_RELATIVE_TOLERANCE = 1e-9;
const PROBE_RELATIVE_STEP = 1e-9;
/** Brent stops when the parabola through its last three points promises less than this fraction more. */
const VALUE_RELATIVE_TOLERANCE = 1e-13;
const GOLDEN = 0.3819660112501051;
/** Grid points closer than this (relative) are one point. */
const DUPLICATE_RELATIVE_SPACING = 1e-9;

export interface EnvelopeKernelPeak {
  /** The peak acceleration, m/s² (0 when the force is 0 everywhere). */
  value: number;
  frequencyHz: number;
  bandIndex: number;
}

/**
 * A reusable search for one set of bands and a fixed number of dampers. `setSystem` takes the system's masses,
 * stiffnesses, dampings and coupled frequencies; `peak(scale)` answers with every damper's damping coefficient
 * multiplied by `scale` (1: the system as given). The system must be damped somewhere (after scaling): an undamped
 * system's response is unbounded at its resonances and is the caller's case to handle.
 */
export class AccelerationEnvelopeKernel {
  readonly tmdCount: number;
  private readonly bands: readonly ForceBand[];
  /** Grid of band b: points bandStart[b] … bandStart[b] + bandCount[b] − 1 (band ends, uniform grid, kinks, coupled frequencies). */
  private readonly bandStart: Int32Array;
  private readonly bandCount: Int32Array;
  private readonly xs: Float64Array;
  private readonly corner: Uint8Array;
  private readonly forceTerm: Float64Array;
  private readonly structureRe: Float64Array;
  private readonly structureIm: Float64Array;
  private readonly inertia: Float64Array;
  private readonly tmdRe: Float64Array;
  private readonly tmdIm: Float64Array;
  private readonly gs: Float64Array;
  /** 1 + 1 system: g = (N0 + s² N2) / ((P − s Q)² + (R + s S)²) at each grid point, six coefficients a point. */
  private readonly pair: Float64Array;
  private readonly stride: number;
  private readonly merged: Float64Array;
  /** Indices of the sampled local maxima of a band (scratch of search). */
  private readonly maxima: Int32Array;
  // The system.
  private massKg = 1;
  private stiffnessNPerM = 1;
  private dampingNsPerM = 0;
  private readonly tmdMassKg: Float64Array;
  private readonly tmdStiffnessNPerM: Float64Array;
  private readonly tmdDampingNsPerM: Float64Array;
  /** Damper damping coefficients of the current peak call (scaled). */
  private readonly tmdDampingNow: Float64Array;
  private ready = false;
  /** Best point of the last polish (−1: none better yet). */
  private polishedG = -1;
  private polishedX = 0;

  constructor(bands: readonly ForceBand[], tmdCount: number) {
    this.bands = bands;
    this.tmdCount = tmdCount;
    const starts = new Int32Array(bands.length + 1);
    let total = 0;
    for (let b = 0; b < bands.length; b++) {
      starts[b] = total;
      total += ENVELOPE_SAMPLES + 1 + (bands[b].kinksHz?.length ?? 0) + tmdCount + 1;
    }
    starts[bands.length] = total;
    this.stride = Math.max(total, 1);
    this.bandStart = starts;
    this.xs = new Float64Array(this.stride);
    this.corner = new Uint8Array(this.stride);
    this.forceTerm = new Float64Array(this.stride);
    this.structureRe = new Float64Array(this.stride);
    this.structureIm = new Float64Array(this.stride);
    this.gs = new Float64Array(this.stride);
    this.pair = new Float64Array(tmdCount === 1 ? 6 * this.stride : 0);
    this.inertia = new Float64Array(this.stride * tmdCount);
    this.tmdRe = new Float64Array(this.stride * tmdCount);
    this.tmdIm = new Float64Array(this.stride * tmdCount);
    this.merged = new Float64Array(this.stride);
    this.maxima = new Int32Array(this.stride);
    this.tmdMassKg = new Float64Array(tmdCount);
    this.tmdStiffnessNPerM = new Float64Array(tmdCount);
    this.tmdDampingNsPerM = new Float64Array(tmdCount);
    this.tmdDampingNow = new Float64Array(tmdCount);
    this.bandCount = new Int32Array(bands.length);
  }

  /** Takes the system's parameters and precomputes the grid (the coupled frequencies are the grid's hints). */
  setSystem(system: ModeTmdSystem): void {
    if (system.tmdCount !== this.tmdCount) throw new RangeError(`the kernel was made for ${this.tmdCount} damper(s), the system has ${system.tmdCount}`);
    this.massKg = system.structureMassKg;
    this.stiffnessNPerM = system.structureStiffnessNPerM;
    this.dampingNsPerM = system.structureDampingNsPerM;
    const n = this.tmdCount;
    for (let j = 0; j < n; j++) {
      this.tmdMassKg[j] = system.tmdMassKg[j];
      this.tmdStiffnessNPerM[j] = system.tmdStiffnessNPerM[j];
      this.tmdDampingNsPerM[j] = system.tmdDampingNsPerM[j];
    }
    const hints = system.coupledFrequenciesHz;
    const stride = this.stride;
    for (let b = 0; b < this.bands.length; b++) {
      const band = this.bands[b];
      const lo = band.loHz;
      const hi = band.hiHz;
      const start = this.bandStart[b];
      // Hints strictly inside the band, sorted (coupled frequencies are ascending; kinks merged in).
      const merged = this.merged;
      let hintCount = 0;
      const kinks = band.kinksHz ?? [];
      for (let i = 0; i < hints.length; i++) if (hints[i] > lo && hints[i] < hi) merged[hintCount++] = hints[i];
      for (let i = 0; i < kinks.length; i++) if (kinks[i] > lo && kinks[i] < hi) merged[hintCount++] = kinks[i];
      // Insertion sort (a handful of values).
      for (let i = 1; i < hintCount; i++) {
        const v = merged[i];
        let k = i - 1;
        while (k >= 0 && merged[k] > v) {
          merged[k + 1] = merged[k];
          k--;
        }
        merged[k + 1] = v;
      }
      const xs = this.xs;
      const corner = this.corner;
      let count = start;
      let h = 0;
      if (hi === lo) {
        xs[count] = lo;
        corner[count++] = 1;
      } else {
        const step = (hi - lo) / ENVELOPE_SAMPLES;
        for (let i = 0; i <= ENVELOPE_SAMPLES; i++) {
          const x = i === ENVELOPE_SAMPLES ? hi : lo + i * step;
          while (h < hintCount && merged[h] < x) {
            count = this.appendPoint(start, count, merged[h], isKink(merged[h], kinks));
            h++;
          }
          count = this.appendPoint(start, count, x, i === 0 || i === ENVELOPE_SAMPLES || isKink(x, kinks));
        }
      }
      this.bandCount[b] = count - start;
      const force = band.forceN;
      for (let i = start; i < count; i++) {
        const omega = TWO_PI * xs[i];
        const omega2 = omega * omega;
        const a = omega2 * force(xs[i]);
        this.forceTerm[i] = a * a;
        this.structureRe[i] = this.stiffnessNPerM - omega2 * this.massKg;
        this.structureIm[i] = omega * this.dampingNsPerM;
        if (n === 1) {
          // X_s / F = den / ((a + i b) den − m ω² (k + i ω c)), den = k − m ω² + i ω c, a = K − M ω², b = ω C;
          // with c scaled by s: Re = P − s Q, Im = R + s S, |den|² = dr² + s² (ω c)².
          const k = this.tmdStiffnessNPerM[0];
          const inertia = this.tmdMassKg[0] * omega2;
          const dr = k - inertia;
          const re = this.stiffnessNPerM - omega2 * this.massKg;
          const im = omega * this.dampingNsPerM;
          const wc = omega * this.tmdDampingNsPerM[0];
          const pair = this.pair;
          const at = 6 * i;
          pair[at] = a * a * dr * dr;
          pair[at + 1] = a * a * wc * wc;
          pair[at + 2] = re * dr - inertia * k;
          pair[at + 3] = im * wc;
          pair[at + 4] = im * dr;
          pair[at + 5] = wc * (re - inertia);
          continue;
        }
        for (let j = 0; j < n; j++) {
          const inertia = this.tmdMassKg[j] * omega2;
          this.inertia[j * stride + i] = inertia;
          this.tmdRe[j * stride + i] = this.tmdStiffnessNPerM[j] - inertia;
          this.tmdIm[j * stride + i] = omega * this.tmdDampingNsPerM[j];
        }
      }
    }
    this.ready = true;
  }

  /**
   * Appends a grid point after `count` (the band's points start at `start`) and returns the new count. A point within
   * 1e-9 of the previous one is merged into it (a hint on a grid point): the parabola through two points that close
   * would be noise. A kink or band end wins the merge, so that F's corners stay exact grid points.
   */
  private appendPoint(start: number, count: number, x: number, isCorner: boolean): number {
    if (count > start && x - this.xs[count - 1] <= DUPLICATE_RELATIVE_SPACING * Math.abs(x)) {
      if (isCorner && this.corner[count - 1] === 0) {
        this.xs[count - 1] = x;
        this.corner[count - 1] = 1;
      }
      return count;
    }
    this.xs[count] = x;
    this.corner[count] = isCorner ? 1 : 0;
    return count + 1;
  }

  /**
   * g = (ω² F)² / |D|² at the grid points [start, end) into gs[offset + i], the dampers' damping scaled by `scale`.
   */
  private sample(start: number, end: number, scale: number, gs: Float64Array, offset: number): void {
    // One loop per case, in functions of their own, so that each stays monomorphic for the optimising compiler.
    if (this.tmdCount === 1) this.samplePair(start, end, scale, gs, offset);
    else this.sampleGeneral(start, end, scale, gs, offset);
  }

  /** The 1 + 1 system in closed form: about 12 flops and one division a point. */
  private samplePair(start: number, end: number, scale: number, gs: Float64Array, offset: number): void {
    const pair = this.pair;
    const s2 = scale * scale;
    for (let i = start; i < end; i++) {
      const at = 6 * i;
      const re = pair[at + 2] - scale * pair[at + 3];
      const im = pair[at + 4] + scale * pair[at + 5];
      gs[offset + i] = (pair[at] + s2 * pair[at + 1]) / (re * re + im * im);
    }
  }

  /** Any number of dampers (the bare structure included). */
  private sampleGeneral(start: number, end: number, scale: number, gs: Float64Array, offset: number): void {
    const forceTerm = this.forceTerm;
    const structureRe = this.structureRe;
    const structureIm = this.structureIm;
    const inertia = this.inertia;
    const tmdRe = this.tmdRe;
    const tmdIm = this.tmdIm;
    const stride = this.stride;
    const n = this.tmdCount;
    for (let i = start; i < end; i++) {
      let dRe = structureRe[i];
      let dIm = structureIm[i];
      let g = -1;
      for (let j = 0; j < n; j++) {
        const k = this.tmdStiffnessNPerM[j];
        const denRe = tmdRe[j * stride + i];
        const denIm = scale * tmdIm[j * stride + i];
        const den2 = denRe * denRe + denIm * denIm;
        if (den2 === 0) {
          g = 0; // an undamped damper at its own frequency holds the structure still
          break;
        }
        const c = -inertia[j * stride + i] / den2;
        dRe += c * (k * denRe + denIm * denIm);
        dIm += c * (denIm * denRe - k * denIm);
      }
      if (g !== 0) g = forceTerm[i] / (dRe * dRe + dIm * dIm);
      gs[offset + i] = g;
    }
  }

  /** Samples every band with the dampers' damping scaled by `scale`, into gs[offset …]. */
  private sampleBands(scale: number, gs: Float64Array, offset: number): void {
    for (let b = 0; b < this.bands.length; b++) this.sample(this.bandStart[b], this.bandStart[b] + this.bandCount[b], scale, gs, offset);
  }

  /** g at any frequency of band `band` with the current (scaled) damping. */
  private value(frequencyHz: number, force: (frequencyHz: number) => number): number {
    const omega = TWO_PI * frequencyHz;
    const omega2 = omega * omega;
    const a = omega2 * force(frequencyHz);
    let dRe = this.stiffnessNPerM - omega2 * this.massKg;
    let dIm = omega * this.dampingNsPerM;
    for (let j = 0; j < this.tmdCount; j++) {
      const k = this.tmdStiffnessNPerM[j];
      const inertia = this.tmdMassKg[j] * omega2;
      const denRe = k - inertia;
      const denIm = omega * this.tmdDampingNow[j];
      const den2 = denRe * denRe + denIm * denIm;
      if (den2 === 0) return 0;
      const c = -inertia / den2;
      dRe += c * (k * denRe + denIm * denIm);
      dIm += c * (denIm * denRe - k * denIm);
    }
    return (a * a) / (dRe * dRe + dIm * dIm);
  }

  /** The envelope peak with every damper's damping coefficient × `dampingScale`; written into `out`. */
  peak(dampingScale = 1, out: EnvelopeKernelPeak = { value: 0, frequencyHz: 0, bandIndex: 0 }): EnvelopeKernelPeak {
    if (!this.ready) throw new Error('AccelerationEnvelopeKernel: setSystem first');
    this.sampleBands(dampingScale, this.gs, 0);
    return this.search(dampingScale, this.gs, 0, out);
  }

  /**
   * The peaks for several damping scales (a row of the robustness map): value k into `values[k]`. All grid samples
   * of the row are computed first in one loop, then each scale's peak is polished.
   */
  peaks(dampingScales: ArrayLike<number>, values: number[] | Float64Array): void {
    if (!this.ready) throw new Error('AccelerationEnvelopeKernel: setSystem first');
    const count = dampingScales.length;
    if (this.rowSamples.length < count * this.stride) this.rowSamples = new Float64Array(count * this.stride);
    const gs = this.rowSamples;
    for (let k = 0; k < count; k++) this.sampleBands(dampingScales[k], gs, k * this.stride);
    const out = this.rowPeak;
    for (let k = 0; k < count; k++) values[k] = this.search(dampingScales[k], gs, k * this.stride, out).value;
  }

  private rowSamples = new Float64Array(0);
  private readonly rowPeak: EnvelopeKernelPeak = { value: 0, frequencyHz: 0, bandIndex: 0 };

  /** The peak from the samples in gs[offset …]: every sampled local maximum worth it is polished. */
  private search(dampingScale: number, gs: Float64Array, offset: number, out: EnvelopeKernelPeak): EnvelopeKernelPeak {
    for (let j = 0; j < this.tmdCount; j++) this.tmdDampingNow[j] = dampingScale * this.tmdDampingNsPerM[j];
    const xs = this.xs;
    const corner = this.corner;
    let bestG = -1;
    let bestX = this.bands.length ? this.bands[0].loHz : 0;
    let bestBand = 0;
    for (let b = 0; b < this.bands.length; b++) {
      const start = this.bandStart[b];
      const end = start + this.bandCount[b];
      const force = this.bands[b].forceN;
      // One pass: the largest sample and the sampled local maxima.
      const maxima = this.maxima;
      let maximumCount = 0;
      let top = 0;
      let topAt = start;
      let previous = -1;
      let current = gs[offset + start];
      for (let i = start; i < end; i++) {
        const next = i < end - 1 ? gs[offset + i + 1] : -1;
        if (current > top) {
          top = current;
          topAt = i;
        }
        if (current >= previous && current >= next && current > 0) maxima[maximumCount++] = i;
        previous = current;
        current = next;
      }
      let bandG = top;
      let bandX = xs[topAt];
      if (top > 0) {
        const threshold = 0.25 * top; // half the largest sample of the magnitude
        for (let m = 0; m < maximumCount; m++) {
          const i = maxima[m];
          const g = gs[offset + i];
          if (g < threshold) continue;
          const left = i > start ? gs[offset + i - 1] : -1;
          const right = i < end - 1 ? gs[offset + i + 1] : -1;
          const a = i > start ? xs[i - 1] : xs[i];
          const c = i < end - 1 ? xs[i + 1] : xs[i];
          if (!(c > a)) continue;
          if (corner[i] === 1) {
            // F may change slope here (or the band ends): look 1e-9 to each side and polish only a rising side.
            const x = xs[i];
            const h = PROBE_RELATIVE_STEP * x;
            if (i > start) {
              const xl = x - h;
              const gl = this.value(xl, force);
              if (gl > g) this.polish(a, x, xl, gl, left, a, g, x, force);
            }
            if (i < end - 1) {
              const xr = x + h;
              const gr = this.value(xr, force);
              if (gr > g) this.polish(x, c, xr, gr, g, x, right, c, force);
            }
          } else {
            this.polish(a, c, xs[i], g, left, a, right, c, force);
          }
          if (this.polishedG > bandG) {
            bandG = this.polishedG;
            bandX = this.polishedX;
          }
          this.polishedG = -1;
        }
      }
      if (bandG > bestG) {
        bestG = bandG;
        bestX = bandX;
        bestBand = b;
      }
    }
    out.value = Math.sqrt(Math.max(bestG, 0));
    out.frequencyHz = bestX;
    out.bandIndex = bestBand;
    return out;
  }

  /**
   * Brent's method (maximising g) on [a, b] from the point x with value gx, the other two known points w (gw) and
   * v (gv) giving the first parabola. The best point is left in polishedG / polishedX.
   */
  private polish(a: number, b: number, x: number, gx: number, gw: number, w: number, gv: number, v: number, force: (f: number) => number): void {
    // Minimise −g (Brent 1973, procedure localmin), with w, v and e set so that the first step may be parabolic.
    let fx = -gx;
    let fw = -gw;
    let fv = -gv;
    if (fw < fv) {
      // w must be the second best.
      const t = w;
      w = v;
      v = t;
      const ft = fw;
      fw = fv;
      fv = ft;
    }
    if (w === x || !(fw >= fx)) {
      w = x;
      fw = fx;
    }
    let d = 0;
    let e = b - a;
    for (let iteration = 0; iteration < 100; iteration++) {
      const m = 0.5 * (a + b);
      const tol = POLISH_RELATIVE_TOLERANCE * Math.abs(x) + 1e-300;
      const t2 = 2 * tol;
      if (Math.abs(x - m) <= t2 - 0.5 * (b - a)) break;
      let useGolden = true;
      let settled = false;
      if (Math.abs(e) > tol) {
        let r = (x - w) * (fx - fv);
        let q = (x - v) * (fx - fw);
        let p = (x - v) * q - (x - w) * r;
        q = 2 * (q - r);
        if (q > 0) p = -p;
        else q = -q;
        r = e;
        e = d;
        if (q !== 0 && Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
          d = p / q;
          // The parabola through x, w, v promises at most f[x, w, v] d² more than the best value so far: below 1e-13
          // of it, the best value is the peak's to that accuracy and the search stops without another point.
          if (Math.abs(x - w) > t2 && Math.abs(x - v) > t2 && Math.abs(w - v) > t2) {
            const curvature = ((fx - fw) / (x - w) - (fx - fv) / (x - v)) / (w - v);
            if (Math.abs(curvature) * d * d <= VALUE_RELATIVE_TOLERANCE * Math.abs(fx)) break;
          }
          // The vertex moves by less than the tolerance on the frequency: this is the last point.
          settled = Math.abs(d) < tol;
          const u = x + d;
          if (u - a < t2 || b - u < t2) d = x < m ? tol : -tol;
          useGolden = false;
        }
      }
      if (useGolden) {
        e = (x < m ? b : a) - x;
        d = GOLDEN * e;
      }
      const u = Math.abs(d) >= tol ? x + d : x + (d > 0 ? tol : -tol);
      const fu = -this.value(u, force);
      if (fu <= fx) {
        if (u < x) b = x;
        else a = x;
        v = w;
        fv = fw;
        w = x;
        fw = fx;
        x = u;
        fx = fu;
      } else {
        if (u < x) a = u;
        else b = u;
        if (fu <= fw || w === x) {
          v = w;
          fv = fw;
          w = u;
          fw = fu;
        } else if (fu <= fv || v === x || v === w) {
          v = u;
          fv = fu;
        }
      }
      if (settled) break;
    }
    if (-fx > this.polishedG) {
      this.polishedG = -fx;
      this.polishedX = x;
    }
  }
}

function isKink(x: number, kinks: readonly number[]): boolean {
  for (let k = 0; k < kinks.length; k++) if (kinks[k] === x) return true;
  return false;
}

/** One kernel per bands array and damper count, reused by every search on that load (no allocation per search). */
const kernels = new WeakMap<readonly ForceBand[], AccelerationEnvelopeKernel[]>();

/** The cached kernel for these bands (the same array object) and this many dampers. */
export function accelerationEnvelopeKernel(bands: readonly ForceBand[], tmdCount: number): AccelerationEnvelopeKernel {
  let list = kernels.get(bands);
  if (!list) {
    list = [];
    kernels.set(bands, list);
  }
  let kernel = list[tmdCount];
  if (!kernel) {
    kernel = new AccelerationEnvelopeKernel(bands, tmdCount);
    list[tmdCount] = kernel;
  }
  return kernel;
}
