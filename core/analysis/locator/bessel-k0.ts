/**
 * Modified Bessel function of the second kind, order 0, by the polynomial approximations of
 * Abramowitz & Stegun (1964) 9.8.1 (I0, |x| ≤ 3.75), 9.8.5 (K0, 0 < x ≤ 2) and 9.8.6 (K0, x ≥ 2);
 * absolute error below 1e-7 (9.8.5) and relative error below 2e-7 (9.8.6) as stated there.
 */
export function besselI0Small(x: number): number {
  const t = (x / 3.75) ** 2;
  return 1 + t * (3.5156229 + t * (3.0899424 + t * (1.2067492 + t * (0.2659732 + t * (0.0360768 + t * 0.0045813)))));
}

export function besselK0(x: number): number {
  if (!(x > 0)) throw new Error(`K0 is defined for x > 0, got ${x}`);
  if (x <= 2) {
    const u = (x / 2) ** 2;
    return (
      -Math.log(x / 2) * besselI0Small(x) +
      (-0.57721566 +
        u * (0.4227842 + u * (0.23069756 + u * (0.0348859 + u * (0.00262698 + u * (0.0001075 + u * 0.0000074))))))
    );
  }
  const v = 2 / x;
  return (
    (Math.exp(-x) / Math.sqrt(x)) *
    (1.25331414 +
      v * (-0.07832358 + v * (0.02189568 + v * (-0.01062446 + v * (0.00587872 + v * (-0.0025154 + v * 0.00053208))))))
  );
}
