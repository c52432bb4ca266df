// Ground drivetrain geometry. Ratios are motor turns per wheel turn.

/** Final drive ratio = spur ÷ pinion × internal (gearbox) ratio. */
export function finalDriveRatio(spurTeeth: number, pinionTeeth: number, internalRatio: number): number {
  return (spurTeeth / pinionTeeth) * internalRatio;
}

/** Distance travelled per motor turn, mm: tyre circumference ÷ final drive ratio. */
export function rolloutMm(tireDiameterMm: number, finalDrive: number): number {
  return (Math.PI * tireDiameterMm) / finalDrive;
}

export function wheelRpm(motorRpm: number, finalDrive: number): number {
  return motorRpm / finalDrive;
}

/** Road speed at a motor speed with no slip, km/h. */
export function speedKmhAt(motorRpm: number, finalDrive: number, tireDiameterMm: number): number {
  // rev/min × m/rev = m/min; × 60 / 1000 = km/h.
  return ((wheelRpm(motorRpm, finalDrive) * Math.PI * tireDiameterMm) / 1000) * (60 / 1000);
}

/** Motor speed in rad/s for a road speed in m/s. */
export function motorOmegaAt(speedMps: number, finalDrive: number, tireDiameterMm: number): number {
  return (speedMps / (tireDiameterMm / 2000)) * finalDrive;
}
