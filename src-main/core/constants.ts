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

/**
 * Sea water density, kg/m³: the usual round figure for surface sea water (about 35 g/kg
 * salinity, 15 °C gives about 1025.9 kg/m³ by the UNESCO 1980 equation of state of sea water;
 * from memory). Denser than fresh water, so a propeller in the sea asks for more current.
 */
export const SEA_WATER_DENSITY = 1025;

/** Speed of sound in air at ISA sea level (15 °C), m/s (ISO 2533:1975, ICAO Doc 7488). */
export const SPEED_OF_SOUND_SEA_LEVEL = 340.294;

/**
 * Share of the speed of sound a propeller tip may reach before the prop-tip-speed rule reads
 * over. Common practice keeps tip Mach under about 0.85: above it compressibility losses and
 * noise climb steeply and small propellers are loaded beyond what they are designed for.
 */
export const PROP_TIP_MACH_LIMIT = 0.85;

/**
 * Length of the full-throttle run from standstill the continuous current is judged over, when a
 * build sets none: about a club straight at full throttle. Our own default, stated on the sheet.
 */
export const DEFAULT_RUN_LENGTH_S = 4;

/**
 * Share of the weight on the driven axle of a 2WD car or truck when none is recorded. Rear-drive
 * buggies and trucks carry about 60–65 % on the rear axle at rest and launch moves more weight
 * rearward (common practice, from memory); 0.7 keeps the launch current on the high side.
 */
export const DEFAULT_2WD_DRIVEN_SHARE = 0.7;

/**
 * Packs joined in parallel should be within this voltage per cell of each other when they are
 * connected (common practice, from memory): more and the fuller pack drives a large current
 * into the other.
 */
export const PARALLEL_MATCH_VOLTS_PER_CELL = 0.1;

/** Cell voltage at which a controller rated only in cells is taken to be rated (LiPo full charge). */
export const CONTROLLER_VOLTS_PER_RATED_CELL = 4.2;
