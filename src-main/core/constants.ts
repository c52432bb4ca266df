// Physical constants the physics uses, in SI.

/** Standard acceleration of gravity, m/s² (exact, 3rd CGPM 1901). */
export const STANDARD_GRAVITY = 9.80665;

/** Air density at ISA sea level (15 °C, 101 325 Pa), kg/m³. */
export const AIR_DENSITY = 1.225;

/**
 * Fresh water density, kg/m³. Rounded: fresh water is 999.97 kg/m³ at 4 °C and about 998 kg/m³
 * at 20 °C (handbook values); the 0.2 % difference is far below the spread of propeller
 * coefficients, so the round figure is used for boats.
 */
export const FRESH_WATER_DENSITY = 1000;

/** Speed of sound in air at ISA sea level, m/s. */
export const SPEED_OF_SOUND_SEA_LEVEL = 340.29;

/**
 * Share of the speed of sound a propeller tip may reach before the prop-tip-speed rule reads
 * over. Common practice keeps tip Mach under about 0.85: above it compressibility losses and
 * noise climb steeply and small propellers are loaded beyond what they are designed for.
 */
export const PROP_TIP_MACH_LIMIT = 0.85;

/** Cell voltage at which a controller rated only in cells is taken to be rated (LiPo full charge). */
export const CONTROLLER_VOLTS_PER_RATED_CELL = 4.2;
