import { EngineError } from '../errors.ts';
import { logNormalUpperTail } from './normal-tail.ts';
import { sigmaFromLogTwoSidedP } from './significance.ts';

/** Result of gaussianDifferenceTest: plain data. */
export interface GaussianDifference {
  z: number;
  logP: number;
  pValue: number;
  sigma: number;
  /** ln N(observed; predicted, combined σ): the Gaussian log-likelihood of the observation. */
  logLikelihood: number;
  combinedError: number;
}

/**
 * Is a published value ± error consistent with a prediction ± Monte Carlo error? The two
 * independent Gaussian errors add in quadrature, z = (predicted − observed) / √(error² + se²),
 * and the two-sided p = 2 Q(|z|) (common practice, no source; e.g. Taylor 1997, An Introduction
 * to Error Analysis, 2nd ed., §5.7). Computed from ln Q so that σ stays finite far out.
 * Valid for finite values, error ≥ 0, se ≥ 0, not both 0.
 * Example: predicted 0.118 ± 0.001 against 0.10 ± 0.02 → z = 0.899, p = 0.369, 0.90σ.
 */
export function gaussianDifferenceTest(predicted: number, se: number, observed: number, error: number): GaussianDifference {
  for (const [name, v] of [['predicted', predicted], ['observed', observed]] as const) {
    if (!Number.isFinite(v)) throw new EngineError(name, v, 'finite numbers');
  }
  if (!(se >= 0) || se === Infinity) throw new EngineError('se', se, '[0, Infinity)');
  if (!(error >= 0) || error === Infinity) throw new EngineError('error', error, '[0, Infinity)');
  const combinedError = Math.hypot(error, se);
  if (combinedError === 0) throw new EngineError('error', error, '(0, Infinity) when se = 0');
  const z = (predicted - observed) / combinedError;
  const logP = Math.min(0, Math.LN2 + logNormalUpperTail(Math.abs(z)));
  return {
    z,
    logP,
    pValue: Math.exp(logP),
    sigma: sigmaFromLogTwoSidedP(logP),
    logLikelihood: -0.5 * z * z - Math.log(combinedError) - 0.5 * Math.log(2 * Math.PI),
    combinedError,
  };
}
