import type { ModelId } from '../core/models/field-model';

/**
 * ringfall's own colours for charts and the field map (chosen for this project:
 * distinguishable in print and for common colour-vision deficiencies by hue and
 * lightness together; power laws are also dashed so colour is never the only cue).
 */
export const palette = {
  ink: '#1b2a33',
  readings: '#1b2a33',
  offAxis: '#6b4e9b',
  grid: '#d9dfe3',
  threshold: '#c8611a',
  thresholdNaive: '#c8611a',
  zero: '#6d7a84',
} as const;

const modelColours: Readonly<Record<ModelId, string>> = {
  'loop': '#b23a48',
  'thick-coil': '#2e6f95',
  'solenoid': '#3b8a5a',
  'coil-pair': '#8c6d1f',
  'rectangle': '#7b4f9e',
  'dipole': '#1f8a8a',
  'power-law': '#5d6770',
  'inverse-square': '#a05a8c',
  'inverse-cube': '#707c3a',
};

/** Colour of a model's curve and legend swatch. */
export function modelColour(model: ModelId): string {
  return modelColours[model];
}

/** True for the descriptive power laws, drawn dashed. */
export function isPowerLaw(model: ModelId): boolean {
  return model === 'power-law' || model === 'inverse-square' || model === 'inverse-cube';
}

/** `#rrggbb` with an alpha, as rgba(). */
export function withAlpha(hex: string, alpha: number): string {
  const value = Number.parseInt(hex.slice(1), 16);
  return `rgba(${(value >> 16) & 255}, ${(value >> 8) & 255}, ${value & 255}, ${alpha})`;
}

/**
 * Sequential ramp for |B| on the field map, pale (weak) to deep (strong): our own
 * five stops, interpolated in sRGB. `t` in [0, 1].
 */
export function fieldRamp(t: number): string {
  const stops = ['#f7f3e8', '#e6d9a8', '#9fbf8f', '#3f8a86', '#1d3f63'];
  const clamped = Math.min(1, Math.max(0, t)) * (stops.length - 1);
  const i = Math.min(stops.length - 2, Math.floor(clamped));
  const f = clamped - i;
  const a = Number.parseInt(stops[i]!.slice(1), 16);
  const b = Number.parseInt(stops[i + 1]!.slice(1), 16);
  const channel = (shift: number) => Math.round(((a >> shift) & 255) * (1 - f) + ((b >> shift) & 255) * f);
  return `#${[16, 8, 0].map((s) => channel(s).toString(16).padStart(2, '0')).join('')}`;
}
