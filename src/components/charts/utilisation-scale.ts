/**
 * Stillspan's own colour scale for a value read against a limit (utilisation = value / limit): deep tide well inside
 * the limit, fading to the paper colour at the limit, then ember beyond it, so the line where a design stops passing
 * is where the colours turn. Built from the palette in tailwind.config.ts.
 */
export const utilisationScaleStops = [
  { utilisation: 0, colour: '#082f2c' },
  { utilisation: 0.5, colour: '#176a63' },
  { utilisation: 0.85, colour: '#a9d3ca' },
  { utilisation: 1, colour: '#f6f3ec' },
  { utilisation: 1.2, colour: '#f8e0cc' },
  { utilisation: 1.6, colour: '#c2621f' },
  { utilisation: 2.2, colour: '#8a4213' },
] as const;

const parsed = utilisationScaleStops.map((stop) => ({
  u: stop.utilisation,
  rgb: [1, 3, 5].map((i) => parseInt(stop.colour.slice(i, i + 2), 16)),
}));

/** The scale's colour at a utilisation, as an rgb() string; beyond the ends the end colours. */
export function utilisationColour(utilisation: number): string {
  if (!Number.isFinite(utilisation)) return `rgb(${parsed[parsed.length - 1].rgb.join(',')})`;
  if (utilisation <= parsed[0].u) return `rgb(${parsed[0].rgb.join(',')})`;
  for (let i = 1; i < parsed.length; i++) {
    if (utilisation <= parsed[i].u) {
      const a = parsed[i - 1];
      const b = parsed[i];
      const t = (utilisation - a.u) / (b.u - a.u);
      const rgb = a.rgb.map((value, k) => Math.round(value + t * (b.rgb[k] - value)));
      return `rgb(${rgb.join(',')})`;
    }
  }
  return `rgb(${parsed[parsed.length - 1].rgb.join(',')})`;
}
