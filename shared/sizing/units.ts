/**
 * Length units. Makers measure in both, so every function takes the unit explicitly and
 * converts through centimetres with the exact legal definitions, never through rounded factors.
 */

/** International yard and pound agreement, 1959: 1 in = 2.54 cm exactly. */
export const CM_PER_INCH = 2.54;
/** Same agreement: 1 yd = 0.9144 m exactly (36 in × 2.54 cm). */
export const METRES_PER_YARD = 0.9144;
export const UNITS_SOURCE = 'international yard and pound agreement, 1959';

export type LengthUnit = 'cm' | 'in';
export type YarnUnit = 'm' | 'yd';

export const toCm = (value: number, unit: LengthUnit): number => (unit === 'cm' ? value : value * CM_PER_INCH);
export const fromCm = (cm: number, unit: LengthUnit): number => (unit === 'cm' ? cm : cm / CM_PER_INCH);

export const yardsToMetres = (yards: number): number => yards * METRES_PER_YARD;
export const metresToYards = (metres: number): number => metres / METRES_PER_YARD;

export const toYards = (value: number, unit: YarnUnit): number => (unit === 'yd' ? value : metresToYards(value));
