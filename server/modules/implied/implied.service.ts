import {
  IMPLIED_CONFIDENCE_LABEL,
  IMPLIED_DIFFERENCE,
  IMPLIED_GRID_POINTS,
  IMPLIED_PRIOR,
  type ImpliedOccurrenceAnswer,
  type ImpliedOccurrenceBody,
} from '../../../shared/contracts/implied-occurrence.ts';
import type { Sample } from '../../../shared/contracts/samples.ts';
import { multiplierMaxFor } from '../../../shared/engine/kernel/scenario-physics.ts';
import { impliedMultiplier } from '../../../shared/engine/stats/implied-occurrence.ts';
import { AppError, badRequest, notFound } from '../../lib/errors.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import type { FitsService } from '../fits/fits.service.ts';
import type { RunsService } from '../runs/runs.service.ts';
import type { SamplesService } from '../samples/samples.service.ts';
import type { ScenariosService } from '../scenarios/scenarios.service.ts';
import { credibleAnswer, impliedMethodsText } from './implied-text.ts';

const questionNotFound = () => notFound('That implied-occurrence question');

/**
 * The one-run response to the multiplier is exact for the fraction among all white dwarfs
 * only (a white dwarf's setting itself changes with the multiplier), so a sample of one
 * setting is sent to a multiplier sweep instead.
 */
function countsOf(sample: Sample, field: string): { magnetic: number; total: number } {
  if (sample.kind !== 'counts' || sample.magnetic === null || sample.total === null) {
    throw badRequest('Implied occurrence needs a sample with counts (magnetic of total); this one states only a fraction or mean masses.', field);
  }
  if (sample.setting !== 'all') {
    throw badRequest(
      `This sample counts only ${sample.setting === 'single' ? 'single white dwarfs' : 'white dwarfs with a detached companion'}; implied occurrence from one run is exact only for a sample of all white dwarfs. Sweep companions.multiplier and compare with this sample instead.`,
      field,
    );
  }
  return { magnetic: sample.magnetic, total: sample.total };
}

/**
 * "What occurrence does my count imply?" as the one-parameter fit over companions.multiplier:
 * the fit's run (one pass, every grid node from the same draws) also carries the exact
 * multiplier response, from which today's test-inversion confidence range is computed; the
 * fit's posterior gives the credible interval beside it.
 */
export function createImpliedService(deps: { runs: RunsService; fits: FitsService; samples: SamplesService; scenarios: ScenariosService }) {
  const { runs, fits, samples, scenarios } = deps;

  /** The test-inversion answer from a finished run's exact multiplier response; null while it has no result. */
  async function confidenceFrom(departmentId: string, runId: string, counts: { magnetic: number; total: number }) {
    try {
      const { result } = await runs.finishedResult(departmentId, runId);
      if (result.counts.whiteDwarfs === 0) return { whiteDwarfs: 0, confidence: null };
      return { whiteDwarfs: result.counts.whiteDwarfs, confidence: impliedMultiplier(result.multiplierResponse, counts) };
    } catch (error) {
      if (error instanceof AppError && error.code === 'run_not_finished') return { whiteDwarfs: null, confidence: null };
      throw error;
    }
  }

  return {
    /**
     * Queues the fit: m on IMPLIED_GRID_POINTS nodes from 0 to the largest multiplier the
     * scenario's rows allow, a uniform prior, the sample's count as the only constraint.
     * Credit is reserved for every node, like any fit.
     */
    async start(auth: RequestAuth, body: ImpliedOccurrenceBody) {
      const department = departmentOf(auth);
      const sample = await samples.visible(department.id, body.sampleId);
      const counts = countsOf(sample, 'sampleId');
      const source = await scenarios.resolve(department.id, body.scenarioId);
      const base = await runs.snapshotOf(department.id, source.scenario, { systems: body.systems, seed: body.seed });
      // The answer scales the scenario's companion occurrences; with none there is nothing to
      // scale, so refuse before spending a run on it.
      const rows = base.companions.rows ?? [];
      if (!rows.some((r) => r.occurrence > 0)) {
        throw badRequest(
          `The scenario "${source.name}" has no occurrence table to scale (${rows.length === 0 ? 'it lists no companion rows' : 'every companion row has occurrence 0'}), so no occurrence can be implied. Choose a scenario with companions, or add an occurrence table to this one.`,
          'scenarioId',
        );
      }
      const label = sample.name;
      const { id, runId } = await fits.queue(auth, {
        source: { scenarioId: body.scenarioId, version: source.version, name: source.name },
        base,
        parameters: [{ path: 'companions.multiplier', min: 0, max: multiplierMaxFor(rows), points: IMPLIED_GRID_POINTS, scale: 'linear', prior: IMPLIED_PRIOR }],
        constraints: [
          {
            id: 'sample',
            name: label,
            citation: sample.citation,
            constraint: {
              kind: 'fraction', setting: 'all', ...counts, label,
              ...(sample.citation ? { citation: sample.citation } : {}),
              ...(sample.fieldThresholdMG !== null ? { fieldThresholdMG: sample.fieldThresholdMG } : {}),
            },
          },
        ],
        constraintSet: { id: sample.id, name: `Sample “${sample.name}”`, version: null },
        name: `Implied occurrence: ${source.name} given ${sample.name}`.slice(0, 160),
        implied: { sample: { id: sample.id, name: sample.name, ...counts }, scenarioMultiplier: base.companions.multiplier },
      });
      return { fitId: id, runId, sampleId: sample.id };
    },

    /** Progress, then both answers: the test-inversion confidence range and the fit's credible interval. */
    async answer(auth: RequestAuth, fitId: string): Promise<ImpliedOccurrenceAnswer> {
      const department = departmentOf(auth);
      const fit = await fits.detail(auth, fitId);
      if (!fit.implied || !fit.runId) throw questionNotFound();
      const { sample, scenarioMultiplier } = fit.implied;
      const counts = { magnetic: sample.magnetic, total: sample.total };
      const settled = fit.status !== 'queued' && fit.status !== 'cancelled';
      const { whiteDwarfs, confidence } = settled ? await confidenceFrom(department.id, fit.runId, counts) : { whiteDwarfs: null, confidence: null };
      const grid = fit.grid[0];
      const credible = fit.posterior ? credibleAnswer(fit.posterior, grid, counts) : null;
      const labelled = confidence ? { ...confidence, kind: 'testInversion' as const, label: IMPLIED_CONFIDENCE_LABEL } : null;
      return {
        fitId: fit.id,
        runId: fit.runId,
        ownerUserId: fit.ownerUserId,
        status: fit.status,
        progress: fit.progress,
        error: fit.error,
        scenarioId: fit.scenarioId,
        scenarioName: fit.scenarioName,
        scenarioVersion: fit.scenarioVersion,
        systems: fit.systems,
        seed: fit.seed,
        engineVersion: fit.engineVersion,
        pointCount: fit.pointCount,
        costCredits: fit.costCredits,
        sample,
        scenarioMultiplier,
        whiteDwarfs,
        confidence: labelled,
        credible,
        difference: IMPLIED_DIFFERENCE,
        methods: labelled && credible && fit.methods ? impliedMethodsText({ sample, scenarioName: fit.scenarioName, confidence: labelled, credible, fitMethods: fit.methods }) : null,
      };
    },

    /** Today's answer from any finished run: the test-inversion range from its exact multiplier response. */
    async fromRun(auth: RequestAuth, runId: string, sampleId: string) {
      const department = departmentOf(auth);
      const { result } = await runs.finishedResult(department.id, runId);
      const sample = await samples.visible(department.id, sampleId);
      const counts = countsOf(sample, 'sample');
      if (result.counts.whiteDwarfs === 0) throw badRequest('The run has no white dwarfs, so no occurrence is implied.', 'runId');
      return {
        runId,
        sample: { id: sample.id, name: sample.name, ...counts },
        runMultiplier: result.multiplierResponse.runMultiplier,
        ...impliedMultiplier(result.multiplierResponse, counts),
      };
    },
  };
}

export type ImpliedService = ReturnType<typeof createImpliedService>;
