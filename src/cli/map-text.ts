// Plain-text tables of `crest map`: a map (periods down, masses across, percentages) and the
// 50% / 90% detection masses per period.
import { levelRows, type LevelMass } from '../rv/injection-map.js';
import { fmt, renderTable, type Column } from '../report/table.js';

/** The detection probability of every cell in percent, periods down and masses across. */
export function mapTableText(periodsDays: number[], msinisEarth: number[], detection: number[][]): string {
  const columns: Column[] = [
    { header: 'P (d) \\ M⊕', align: 'right' },
    ...msinisEarth.map((m) => ({ header: fmt(m, m < 10 ? 1 : 0), align: 'right' as const })),
  ];
  const rows = periodsDays.map((p, i) => [fmt(p, p < 10 ? 2 : 1), ...detection[i]!.map((d) => String(Math.round(100 * d)))]);
  return renderTable(columns, rows);
}

/** A level's mass as text: the interpolated mass, or "above grid" / "below grid". */
export function levelMassText(mass: LevelMass): string {
  return mass.where === 'inside' ? fmt(mass.msiniEarth, 1) : `${mass.where}`;
}

/** Period, 50% and 90% detection mass, for one or more maps of the same grid side by side. */
export function levelTableText(periodsDays: number[], msinisEarth: number[], maps: { label: string; detection: number[][] }[]): string {
  const perMap = maps.map((m) => levelRows(periodsDays, msinisEarth, m.detection));
  const suffix = (label: string) => (maps.length > 1 ? ` ${label}` : '');
  const columns: Column[] = [
    { header: 'P (d)', align: 'right' },
    ...maps.flatMap((m) => [
      { header: `50% (M⊕)${suffix(m.label)}`, align: 'right' as const },
      { header: `90% (M⊕)${suffix(m.label)}`, align: 'right' as const },
    ]),
  ];
  const rows = periodsDays.map((p, i) => [fmt(p, p < 10 ? 2 : 1), ...perMap.flatMap((rowsOfMap) => rowsOfMap[i]!.levels.map((l) => levelMassText(l.mass)))]);
  return renderTable(columns, rows);
}
