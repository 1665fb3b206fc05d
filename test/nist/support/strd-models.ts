/**
 * The 27 NIST StRD nonlinear-regression models (formulas as printed in each .dat file)
 * with hand-derived analytic gradients. `value(b, x1, x2)` is the model; `gradient`
 * writes ∂f/∂bⱼ into g. b is 0-based here: b[0] is the file's b1. Nelson's response is
 * log(y), so its `transform` maps y → ln y before fitting.
 */
export interface StrdModel {
  readonly value: (b: Float64Array, x: number, x2: number) => number;
  readonly gradient: (b: Float64Array, x: number, x2: number, g: Float64Array) => void;
  readonly transform?: (y: number) => number;
}

const exponentialRise: StrdModel = {
  // y = b1*(1-exp[-b2*x])
  value: (b, x) => b[0]! * (1 - Math.exp(-b[1]! * x)),
  gradient: (b, x, _, g) => {
    const e = Math.exp(-b[1]! * x);
    g[0] = 1 - e;
    g[1] = b[0]! * x * e;
  },
};

const chwirut: StrdModel = {
  // y = exp[-b1*x]/(b2+b3*x)
  value: (b, x) => Math.exp(-b[0]! * x) / (b[1]! + b[2]! * x),
  gradient: (b, x, _, g) => {
    const e = Math.exp(-b[0]! * x);
    const d = b[1]! + b[2]! * x;
    g[0] = (-x * e) / d;
    g[1] = -e / (d * d);
    g[2] = (-x * e) / (d * d);
  },
};

const lanczos: StrdModel = {
  // y = b1*exp(-b2*x) + b3*exp(-b4*x) + b5*exp(-b6*x)
  value: (b, x) => b[0]! * Math.exp(-b[1]! * x) + b[2]! * Math.exp(-b[3]! * x) + b[4]! * Math.exp(-b[5]! * x),
  gradient: (b, x, _, g) => {
    for (let k = 0; k < 6; k += 2) {
      const e = Math.exp(-b[k + 1]! * x);
      g[k] = e;
      g[k + 1] = -b[k]! * x * e;
    }
  },
};

const gauss: StrdModel = {
  // y = b1*exp(-b2*x) + b3*exp(-(x-b4)**2/b5**2) + b6*exp(-(x-b7)**2/b8**2)
  value: (b, x) =>
    b[0]! * Math.exp(-b[1]! * x) +
    b[2]! * Math.exp(-((x - b[3]!) ** 2) / b[4]! ** 2) +
    b[5]! * Math.exp(-((x - b[6]!) ** 2) / b[7]! ** 2),
  gradient: (b, x, _, g) => {
    const e = Math.exp(-b[1]! * x);
    g[0] = e;
    g[1] = -b[0]! * x * e;
    for (const k of [2, 5]) {
      const d = x - b[k + 1]!;
      const w = b[k + 2]!;
      const peak = Math.exp(-(d * d) / (w * w));
      g[k] = peak;
      g[k + 1] = (b[k]! * peak * 2 * d) / (w * w);
      g[k + 2] = (b[k]! * peak * 2 * d * d) / (w * w * w);
    }
  },
};

/** Rational function: numerator degree `top`, denominator 1 + Σ b·x^k of degree `bottom`. */
function rational(top: number, bottom: number): StrdModel {
  const parts = (b: Float64Array, x: number): [number, number] => {
    let numerator = 0;
    let denominator = 1;
    for (let k = 0; k <= top; k++) numerator += b[k]! * x ** k;
    for (let k = 1; k <= bottom; k++) denominator += b[top + k]! * x ** k;
    return [numerator, denominator];
  };
  return {
    value: (b, x) => {
      const [numerator, denominator] = parts(b, x);
      return numerator / denominator;
    },
    gradient: (b, x, _, g) => {
      const [numerator, denominator] = parts(b, x);
      for (let k = 0; k <= top; k++) g[k] = x ** k / denominator;
      for (let k = 1; k <= bottom; k++) g[top + k] = (-numerator * x ** k) / (denominator * denominator);
    },
  };
}

const logistic: StrdModel = {
  // y = b1 / (1+exp[b2-b3*x])
  value: (b, x) => b[0]! / (1 + Math.exp(b[1]! - b[2]! * x)),
  gradient: (b, x, _, g) => {
    const e = Math.exp(b[1]! - b[2]! * x);
    const u = 1 + e;
    g[0] = 1 / u;
    g[1] = (-b[0]! * e) / (u * u);
    g[2] = (b[0]! * x * e) / (u * u);
  },
};

export const STRD_MODELS: Readonly<Record<string, StrdModel>> = {
  Misra1a: exponentialRise,
  BoxBOD: exponentialRise,
  Chwirut1: chwirut,
  Chwirut2: chwirut,
  Lanczos1: lanczos,
  Lanczos2: lanczos,
  Lanczos3: lanczos,
  Gauss1: gauss,
  Gauss2: gauss,
  Gauss3: gauss,
  Kirby2: rational(2, 2),
  Hahn1: rational(3, 3),
  Thurber: rational(3, 3),
  Rat42: logistic,
  Misra1b: {
    // y = b1 * (1-(1+b2*x/2)**(-2))
    value: (b, x) => b[0]! * (1 - (1 + (b[1]! * x) / 2) ** -2),
    gradient: (b, x, _, g) => {
      const u = 1 + (b[1]! * x) / 2;
      g[0] = 1 - u ** -2;
      g[1] = b[0]! * x * u ** -3;
    },
  },
  Misra1c: {
    // y = b1 * (1-(1+2*b2*x)**(-.5))
    value: (b, x) => b[0]! * (1 - (1 + 2 * b[1]! * x) ** -0.5),
    gradient: (b, x, _, g) => {
      const v = 1 + 2 * b[1]! * x;
      g[0] = 1 - v ** -0.5;
      g[1] = b[0]! * x * v ** -1.5;
    },
  },
  Misra1d: {
    // y = b1*b2*x*((1+b2*x)**(-1))
    value: (b, x) => (b[0]! * b[1]! * x) / (1 + b[1]! * x),
    gradient: (b, x, _, g) => {
      const u = 1 + b[1]! * x;
      g[0] = (b[1]! * x) / u;
      g[1] = (b[0]! * x) / (u * u);
    },
  },
  Nelson: {
    // log[y] = b1 - b2*x1 * exp[-b3*x2]
    value: (b, x1, x2) => b[0]! - b[1]! * x1 * Math.exp(-b[2]! * x2),
    gradient: (b, x1, x2, g) => {
      const e = Math.exp(-b[2]! * x2);
      g[0] = 1;
      g[1] = -x1 * e;
      g[2] = b[1]! * x1 * x2 * e;
    },
    transform: Math.log,
  },
  MGH17: {
    // y = b1 + b2*exp[-x*b4] + b3*exp[-x*b5]
    value: (b, x) => b[0]! + b[1]! * Math.exp(-x * b[3]!) + b[2]! * Math.exp(-x * b[4]!),
    gradient: (b, x, _, g) => {
      const e4 = Math.exp(-x * b[3]!);
      const e5 = Math.exp(-x * b[4]!);
      g[0] = 1;
      g[1] = e4;
      g[2] = e5;
      g[3] = -b[1]! * x * e4;
      g[4] = -b[2]! * x * e5;
    },
  },
  Roszman1: {
    // y = b1 - b2*x - arctan[b3/(x-b4)]/pi
    value: (b, x) => b[0]! - b[1]! * x - Math.atan(b[2]! / (x - b[3]!)) / Math.PI,
    gradient: (b, x, _, g) => {
      const d = x - b[3]!;
      const q = b[2]! / d;
      const slope = 1 / (Math.PI * (1 + q * q));
      g[0] = 1;
      g[1] = -x;
      g[2] = -slope / d;
      g[3] = (-slope * b[2]!) / (d * d);
    },
  },
  ENSO: {
    // y = b1 + b2*cos(2*pi*x/12) + b3*sin(2*pi*x/12) + b5*cos(2*pi*x/b4) + b6*sin(2*pi*x/b4)
    //        + b8*cos(2*pi*x/b7) + b9*sin(2*pi*x/b7)
    value: (b, x) => {
      const a = (2 * Math.PI * x) / 12;
      const a4 = (2 * Math.PI * x) / b[3]!;
      const a7 = (2 * Math.PI * x) / b[6]!;
      return (
        b[0]! + b[1]! * Math.cos(a) + b[2]! * Math.sin(a) + b[4]! * Math.cos(a4) + b[5]! * Math.sin(a4) +
        b[7]! * Math.cos(a7) + b[8]! * Math.sin(a7)
      );
    },
    gradient: (b, x, _, g) => {
      const a = (2 * Math.PI * x) / 12;
      g[0] = 1;
      g[1] = Math.cos(a);
      g[2] = Math.sin(a);
      for (const k of [3, 6]) {
        const period = b[k]!;
        const phase = (2 * Math.PI * x) / period;
        g[k + 1] = Math.cos(phase);
        g[k + 2] = Math.sin(phase);
        g[k] = (phase / period) * (b[k + 1]! * Math.sin(phase) - b[k + 2]! * Math.cos(phase));
      }
    },
  },
  MGH09: {
    // y = b1*(x**2+x*b2) / (x**2+x*b3+b4)
    value: (b, x) => (b[0]! * (x * x + x * b[1]!)) / (x * x + x * b[2]! + b[3]!),
    gradient: (b, x, _, g) => {
      const n = x * x + x * b[1]!;
      const d = x * x + x * b[2]! + b[3]!;
      g[0] = n / d;
      g[1] = (b[0]! * x) / d;
      g[2] = (-b[0]! * n * x) / (d * d);
      g[3] = (-b[0]! * n) / (d * d);
    },
  },
  MGH10: {
    // y = b1 * exp[b2/(x+b3)]
    value: (b, x) => b[0]! * Math.exp(b[1]! / (x + b[2]!)),
    gradient: (b, x, _, g) => {
      const d = x + b[2]!;
      const e = Math.exp(b[1]! / d);
      g[0] = e;
      g[1] = (b[0]! * e) / d;
      g[2] = (-b[0]! * e * b[1]!) / (d * d);
    },
  },
  Eckerle4: {
    // y = (b1/b2) * exp[-0.5*((x-b3)/b2)**2]
    value: (b, x) => (b[0]! / b[1]!) * Math.exp(-0.5 * ((x - b[2]!) / b[1]!) ** 2),
    gradient: (b, x, _, g) => {
      const t = (x - b[2]!) / b[1]!;
      const e = Math.exp(-0.5 * t * t);
      g[0] = e / b[1]!;
      g[1] = ((b[0]! * e) / (b[1]! * b[1]!)) * (t * t - 1);
      g[2] = ((b[0]! / b[1]!) * e * t) / b[1]!;
    },
  },
  Rat43: {
    // y = b1 / ((1+exp[b2-b3*x])**(1/b4))
    value: (b, x) => b[0]! / (1 + Math.exp(b[1]! - b[2]! * x)) ** (1 / b[3]!),
    gradient: (b, x, _, g) => {
      const e = Math.exp(b[1]! - b[2]! * x);
      const u = 1 + e;
      const power = u ** (-1 / b[3]!);
      g[0] = power;
      g[1] = (-b[0]! * power * e) / (u * b[3]!);
      g[2] = (b[0]! * power * e * x) / (u * b[3]!);
      g[3] = (b[0]! * power * Math.log(u)) / (b[3]! * b[3]!);
    },
  },
  Bennett5: {
    // y = b1 * (b2+x)**(-1/b3)
    value: (b, x) => b[0]! * (b[1]! + x) ** (-1 / b[2]!),
    gradient: (b, x, _, g) => {
      const base = b[1]! + x;
      const power = base ** (-1 / b[2]!);
      g[0] = power;
      g[1] = (-b[0]! * power) / (b[2]! * base);
      g[2] = (b[0]! * power * Math.log(base)) / (b[2]! * b[2]!);
    },
  },
  DanWood: {
    // y = b1*x**b2
    value: (b, x) => b[0]! * x ** b[1]!,
    gradient: (b, x, _, g) => {
      const power = x ** b[1]!;
      g[0] = power;
      g[1] = b[0]! * power * Math.log(x);
    },
  },
};
