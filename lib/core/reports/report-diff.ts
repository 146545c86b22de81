// What changed between two published versions of a class report (framework-free).
import type { ReportInputs, ReportResults } from './parity-figures';

export type BoatChange = {
  entryId: string;
  label: string;
  change: 'added' | 'removed' | 'changed' | 'same';
  staticThrustBeforeN: number | null;
  staticThrustAfterN: number | null;
  nozzleBeforeMm: number | null;
  nozzleAfterMm: number | null;
};

type Version = { inputs: ReportInputs; results: ReportResults };

export function diffReports(before: Version, after: Version) {
  const b = new Map((before.results.parity?.boats ?? []).map((x) => [x.id, x]));
  const a = new Map((after.results.parity?.boats ?? []).map((x) => [x.id, x]));
  const ids = [...new Set([...b.keys(), ...a.keys()])];
  const boats: BoatChange[] = ids.map((id) => {
    const x = b.get(id);
    const y = a.get(id);
    const change = !x
      ? 'added'
      : !y
        ? 'removed'
        : Math.abs(x.staticThrustN - y.staticThrustN) > 1e-6 || x.nozzleDiameterMm !== y.nozzleDiameterMm
          ? 'changed'
          : 'same';
    return {
      entryId: id,
      label: (y ?? x)!.label,
      change,
      staticThrustBeforeN: x?.staticThrustN ?? null,
      staticThrustAfterN: y?.staticThrustN ?? null,
      nozzleBeforeMm: x?.nozzleDiameterMm ?? null,
      nozzleAfterMm: y?.nozzleDiameterMm ?? null,
    };
  });
  return {
    boats: boats.filter((x) => x.change !== 'same'),
    spreadBeforePercent: before.results.parity?.summary.spreadPercent ?? null,
    spreadAfterPercent: after.results.parity?.summary.spreadPercent ?? null,
    ruleVersionChanged: before.inputs.ruleVersion.version !== after.inputs.ruleVersion.version,
  };
}
