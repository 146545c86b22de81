// Shown with standings, bulletins and exports: Boreline keeps the series' records; it decides nothing.
export const SERIES_CAUTION =
  "Boreline records the series' results, rules and bulletins; it does not make decisions. The governing body's rules, the series' own regulations, local regulations and the licensed officials decide standings, penalties and appeals. Racing can hurt people: check every figure against the rules in force.";
