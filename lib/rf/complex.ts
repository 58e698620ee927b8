/** A complex number as a plain object, so parser output (re/im pairs) passes straight in. */
export interface Complex {
  re: number;
  im: number;
}

export function createComplex(re: number, im = 0): Complex {
  return { re, im };
}

export function createComplexFromPolar(magnitude: number, angleDeg: number): Complex {
  const angleRad = (angleDeg * Math.PI) / 180;
  return { re: magnitude * Math.cos(angleRad), im: magnitude * Math.sin(angleRad) };
}

export function addComplex(a: Complex, b: Complex): Complex {
  return { re: a.re + b.re, im: a.im + b.im };
}

export function subtractComplex(a: Complex, b: Complex): Complex {
  return { re: a.re - b.re, im: a.im - b.im };
}

export function multiplyComplex(a: Complex, b: Complex): Complex {
  return { re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re };
}

export function divideComplex(a: Complex, b: Complex): Complex {
  const denominator = b.re * b.re + b.im * b.im;
  if (denominator === 0) throw new RangeError("Division by a complex zero");
  return {
    re: (a.re * b.re + a.im * b.im) / denominator,
    im: (a.im * b.re - a.re * b.im) / denominator,
  };
}

export function computeComplexMagnitude(z: Complex): number {
  return Math.hypot(z.re, z.im);
}

/** Principal angle in degrees, (−180, 180]. */
export function computeComplexAngleDeg(z: Complex): number {
  return (Math.atan2(z.im, z.re) * 180) / Math.PI;
}
