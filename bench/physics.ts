/** Figures of the physics core: random numbers and boosts. */
import { boost, setPxPyPzE } from '../src/physics/fourVector.js';
import { RandomStream } from '../src/physics/random.js';
import { ratePerSecond, type Benchmark } from './benchmark.js';

const rng = RandomStream.forStream(12345, 0);
let sink = 0;

export const benchmarks: Benchmark[] = [
  {
    name: 'random_uniform_rate',
    unit: 'numbers/s',
    measure: () =>
      ratePerSecond((n) => {
        let s = 0;
        for (let i = 0; i < n; i++) s += rng.uniform();
        sink += s;
      }, 1_000_000),
  },
  {
    name: 'random_normal_rate',
    unit: 'numbers/s',
    measure: () =>
      ratePerSecond((n) => {
        let s = 0;
        for (let i = 0; i < n; i++) s += rng.normal();
        sink += s;
      }, 1_000_000),
  },
  {
    name: 'lorentz_boost_rate',
    unit: 'boosts/s',
    measure: () => {
      const vectors = new Float64Array(4 * 1024);
      for (let i = 0; i < 1024; i++) setPxPyPzE(vectors, i, rng.normal(), rng.normal(), rng.normal(), 10 + rng.uniform());
      return ratePerSecond((n) => {
        for (let i = 0; i < n; i++) boost(vectors, i & 1023, 0.3, -0.2, (i & 1) === 0 ? 0.5 : -0.5);
        sink += vectors[0];
      }, 1_000_000);
    },
  },
];

export function keepAlive(): number {
  return sink;
}
