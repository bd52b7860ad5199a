import { readCsvTable } from '../../io/csv-table.ts';
import { UsageError, UserError } from '../../errors.ts';
import { bradleyTerry, winsFromPairs } from '../../stats/bradley-terry.ts';
import { reliabilityReport, type Rating } from '../../stats/reliability-report.ts';
import type { Estimate } from '../../stats/result.ts';
import type { Command } from '../command.ts';
import { configFromEnv } from '../../config.ts';
import { calibrate } from '../../stats/calibration.ts';
import { openStore } from '../../store/connect.ts';
import { migrate } from '../../store/migrate.ts';
import { findBatchByName } from '../../store/repos/batches.ts';
import { loadCalibrationItems } from '../../store/repos/calibration-data.ts';

const show = (e: Estimate) => (e.value === null ? `n/a (${e.reason})` : e.value.toFixed(4));
const json = (e: Estimate) => (e.value === null ? null : Math.round(e.value * 1e6) / 1e6);

/** `plumbline stats agreement FILE.csv`: agreement statistics for unit,rater,value data. */
export const statsAgreementCommand: Command = {
  name: 'stats agreement',
  summary: 'agreement statistics (Krippendorff\'s alpha, Fleiss\' kappa, Kendall\'s W) for a unit,rater,value CSV',
  usage: 'plumbline stats agreement FILE.csv [--json]',
  options: { flags: ['json'], maxPositionals: 1 },
  async run(args, io) {
    const path = args.positionals[0];
    if (!path) throw new UsageError('plumbline stats agreement: name a CSV file with the columns unit,rater,value');
    const rows = await readCsvTable(path, ['unit', 'rater', 'value']);
    const ratings: Rating[] = rows.map((r) => {
      if (r.values.value === '' || r.values.value === '.') return null;
      const value = Number(r.values.value);
      if (!Number.isFinite(value)) throw new UserError(`${path}:${r.line}: value "${r.values.value}" is not a number — code categories as numbers (leave the value empty, or ".", for a missing one)`);
      return { unit: r.values.unit, rater: r.values.rater, value };
    }).filter((r): r is Rating => r !== null);
    const report = reliabilityReport(ratings);
    if (args.flags.has('json')) {
      io.out(JSON.stringify({
        units: report.units,
        raters: report.raters,
        ratings: report.ratings,
        krippendorff_alpha: Object.fromEntries(Object.entries(report.krippendorffAlpha).map(([k, v]) => [k, json(v)])),
        fleiss_kappa: json(report.fleissKappa),
        ...(report.kendallW.value !== null ? { kendall_w: json(report.kendallW) } : {}),
        pairwise_agreement: json(report.pairwiseAgreement),
        pairwise_agreement_95: report.pairwiseAgreementInterval,
      }, null, 2));
      return 0;
    }
    io.out(`${report.units} units, ${report.raters} raters, ${report.ratings} ratings`);
    for (const [level, e] of Object.entries(report.krippendorffAlpha)) io.out(`Krippendorff's alpha (${level}): ${show(e)}`);
    io.out(`Fleiss' kappa: ${show(report.fleissKappa)}`);
    io.out(`Kendall's W: ${show(report.kendallW)}`);
    const ci = report.pairwiseAgreementInterval;
    io.out(`pairwise agreement: ${show(report.pairwiseAgreement)}${ci ? ` (95% bootstrap interval ${ci.low.toFixed(3)}–${ci.high.toFixed(3)})` : ''}`);
    return 0;
  },
};

/** `plumbline stats strengths FILE.csv`: Bradley–Terry strengths from winner,loser rows. */
export const statsStrengthsCommand: Command = {
  name: 'stats strengths',
  summary: 'Bradley–Terry strengths from a winner,loser CSV',
  usage: 'plumbline stats strengths FILE.csv [--json]',
  options: { flags: ['json'], maxPositionals: 1 },
  async run(args, io) {
    const path = args.positionals[0];
    if (!path) throw new UsageError('plumbline stats strengths: name a CSV file with the columns winner,loser');
    const rows = await readCsvTable(path, ['winner', 'loser']);
    for (const r of rows) if (!r.values.winner || !r.values.loser || r.values.winner === r.values.loser) throw new UserError(`${path}:${r.line}: a row needs two different names (winner, loser)`);
    const { names, wins } = winsFromPairs(rows.map((r) => [r.values.winner, r.values.loser]));
    const result = bradleyTerry(names, wins);
    const ranked = names.map((name, i) => ({ name, strength: result.strengths[i] })).sort((a, b) => b.strength - a.strength);
    if (args.flags.has('json')) {
      io.out(JSON.stringify({ comparisons: rows.length, iterations: result.iterations, converged: result.converged, strengths: Object.fromEntries(ranked.map((r) => [r.name, Math.round(r.strength * 1e6) / 1e6])) }, null, 2));
      return 0;
    }
    io.out(`${rows.length} comparisons of ${names.length}; strengths scaled to a geometric mean of 1 (MM, ${result.iterations} sweeps${result.converged ? '' : ', not converged'})`);
    for (const r of ranked) io.out(`  ${r.name.padEnd(20)} ${r.strength.toFixed(4)}`);
    return 0;
  },
};

/** `plumbline stats calibrate --batch NAME`: heuristics against final human rankings. */
export const statsCalibrateCommand: Command = {
  name: 'stats calibrate',
  summary: 'how the suggested order and each criterion agree with final human rankings, and biases',
  usage: 'plumbline stats calibrate --batch NAME [--json]',
  options: { values: ['batch'], flags: ['json'] },
  async run(args, io) {
    const name = args.values.batch;
    if (!name) throw new UsageError('plumbline stats calibrate: say which batch with --batch NAME');
    const store = await openStore(configFromEnv(io.env).database);
    try {
      await migrate(store);
      const batch = await findBatchByName(store.db, name);
      if (!batch) throw new UserError(`there is no batch "${name}" — the Batches page lists them`);
      const result = calibrate(await loadCalibrationItems(store.db, batch.id));
      if (args.flags.has('json')) {
        io.out(JSON.stringify(result, null, 2));
        return 0;
      }
      if (!result.items) {
        io.out(`${name}: no decided items yet — calibration compares the heuristics with final rankings`);
        return 0;
      }
      const pct = (s: { value: number | null; pairs: number }) => (s.value === null ? 'n/a' : `${(s.value * 100).toFixed(1)}% of ${s.pairs} pairs`);
      io.out(`${name}: ${result.items} decided items`);
      io.out(`suggested order agrees with the final ranking on ${pct(result.suggestedOrder)}`);
      io.out('each criterion alone (pairwise accuracy):');
      for (const [id, share] of Object.entries(result.criteria)) io.out(`  ${id.padEnd(32)} ${pct(share)}`);
      io.out(`length bias: the longer response won ${pct(result.lengthBias)} (50% is none)`);
      io.out(`position bias: the response shown earlier was ranked better in ${pct(result.positionBias)} (50% is none)`);
      io.out(`anchoring: ${result.anchoring.revisions} revisions after the reveal, ${result.anchoring.towardSuggested} toward the suggested order`);
      io.out('reviewers\' agreement with the decisions (for calibration and coaching — small samples mislead):');
      for (const [id, share] of Object.entries(result.reviewers)) io.out(`  ${id.padEnd(16)} ${share.value === null ? 'n/a' : `${(share.value * 100).toFixed(1)}%`} over ${share.pairs} items`);
      return 0;
    } finally {
      await store.close();
    }
  },
};
