/** Parsing of the limit options shared by recast, scan and compare (--cl, --method, --uncertainty-model). */
import { TamisError } from '../errors.js';
import type { LimitMethod, UncertaintyModel } from '../stats/index.js';
import { parseNumberOption } from './options.js';

const METHODS: readonly LimitMethod[] = ['exact', 'toys', 'asymptotic', 'auto'];
const MODELS: readonly UncertaintyModel[] = ['lognormal', 'gaussian'];

export function parseLimitChoices(options: { cl: string; method: string; uncertaintyModel: string }): { cl: number; method: LimitMethod; uncertaintyModel: UncertaintyModel } {
  const cl = parseNumberOption('--cl', options.cl, { min: 0.5, max: 0.9999 });
  if (!METHODS.includes(options.method as LimitMethod)) throw new TamisError('bad_input', `expected one of ${METHODS.join(', ')}, got "${options.method}"`, { key: '--method' });
  if (!MODELS.includes(options.uncertaintyModel as UncertaintyModel)) throw new TamisError('bad_input', `expected one of ${MODELS.join(', ')}, got "${options.uncertaintyModel}"`, { key: '--uncertainty-model' });
  return { cl, method: options.method as LimitMethod, uncertaintyModel: options.uncertaintyModel as UncertaintyModel };
}
