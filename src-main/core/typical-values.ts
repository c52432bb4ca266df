// Typical values for a car's or truck's coefficients where the vehicle leaves one empty. Each
// is taken from the top of its range, the side that reads the current high: more drag and more
// rolling resistance load the motor more, more grip lets the launch draw more. A surface not
// recorded takes the highest value over every surface. An entered value always wins.
//
// Sources:
// - Rolling coefficient: full-size tyres roll at about 0.01–0.015 on concrete or asphalt,
//   0.08 on medium-hard soil (J. Y. Wong, "Theory of Ground Vehicles", table of rolling
//   resistance coefficients; from memory). Small hard model tyres on small radii roll harder:
//   0.02–0.04 on pavement or carpet, 0.05–0.1 on dirt or grass (common practice, from memory).
// - Tyre grip μ: peak tyre–road friction about 0.8–0.9 on dry asphalt and about 0.6 on gravel
//   (Wong, table of average peak and sliding friction values; from memory); model tyres on
//   prepared carpet grip above 1 (common practice, from memory); grass about 0.5–0.6 (common
//   practice, from memory).
// - Drag area Cd·A: a bluff model body has Cd about 0.8–1.0 (common practice, from memory);
//   its frontal area is taken from the mass at model scale, A = k·m^(2/3) (geometric scaling:
//   mass grows with the cube of size, area with its square), with k chosen so a 2 kg 1/10 car
//   shows about 0.024 m² and a 3 kg 1/10 short-course truck about 0.05 m² (our own fit to
//   measured bodies of those sizes, from memory).

import type { Surface } from './domain';

export interface SurfaceValues {
  readonly rollingCoefficient: number;
  readonly tractionCoefficient: number;
}

export const SURFACE_VALUES: Readonly<Record<Surface, SurfaceValues>> = {
  asphalt: { rollingCoefficient: 0.03, tractionCoefficient: 0.9 },
  carpet: { rollingCoefficient: 0.04, tractionCoefficient: 1.2 },
  dirt: { rollingCoefficient: 0.08, tractionCoefficient: 0.7 },
  grass: { rollingCoefficient: 0.1, tractionCoefficient: 0.6 },
};

/** Drag coefficient and frontal-area factor (m² per kg^(2/3)) of a bluff model body, by kind. */
export const BODY_VALUES = {
  car: { dragCoefficient: 0.9, areaPerMass23: 0.015 },
  truck: { dragCoefficient: 1.0, areaPerMass23: 0.025 },
} as const;

function highest(pick: (v: SurfaceValues) => number): number {
  return Math.max(...Object.values(SURFACE_VALUES).map(pick));
}

/** The rolling coefficient taken for a surface; the highest of all where it is not recorded. */
export function typicalRollingCoefficient(surface: Surface | null): number {
  return surface === null ? highest((v) => v.rollingCoefficient) : SURFACE_VALUES[surface].rollingCoefficient;
}

/** The tyre grip taken for a surface; the highest of all where it is not recorded. */
export function typicalTractionCoefficient(surface: Surface | null): number {
  return surface === null ? highest((v) => v.tractionCoefficient) : SURFACE_VALUES[surface].tractionCoefficient;
}

/** The drag area Cd·A taken for a car or truck of a mass, m². */
export function typicalDragArea(kind: 'car' | 'truck', massKg: number): number {
  const body = BODY_VALUES[kind];
  return body.dragCoefficient * body.areaPerMass23 * massKg ** (2 / 3);
}
