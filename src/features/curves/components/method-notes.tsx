/** "How this is computed": the method in brief, with the same figures as optimizer/fit's notes. */
export function MethodNotes() {
  return (
    <details className="rounded-plate border border-deck-200 bg-white px-gutter py-3 text-small text-hull-700" data-section="method">
      <summary className="cursor-pointer font-semibold text-hull-800">How these curves are computed</summary>
      <ul className="mt-2 list-disc space-y-1 pl-5">
        <li>
          Each logged day gives one point: average load (kWh ÷ hours run, kW) and fuel rate (kg/h) with the fuel referred to the ISO 3046-1 reference
          calorific value of 42 700 kJ/kg. Days excluded by the chief engineer, days with an error flag, shore-power-only days and days without running
          hours are left out.
        </li>
        <li>
          The fuel rate F(P) = a + b·P + c·P² is fitted by least squares weighted by hours run, with a ≥ 0 and c ≥ 0 enforced exactly (a convex curve),
          and made robust with Huber weights (k = 1.345): days that disagree strongly are down-weighted and listed as outliers, never deleted.
          SFOC = 1000·F(P)/P.
        </li>
        <li>
          When a window has fewer than 30 days or spans less than 20 % of rating, the maker’s shop test is blended in as extra points worth 10 × 30/(30 +
          days) days of data; the table says when and how much.
        </li>
        <li>
          The shaded band is the 95 % confidence band of the mean SFOC. Dashed parts of a curve lie outside the loads the days covered (extrapolated).
          Daily averages of a convex curve read slightly high when the load varies within the day (by c × variance of the load).
        </li>
        <li>
          Drift: each day’s SFOC moved to the set’s usual load (median daily load) along the fitted curve, against running hours since the last top or
          major overhaul. The alert fires when the latest 500 running hours are above the first 500 h after overhaul by more than 2 % with 95 % one-sided
          confidence.
        </li>
      </ul>
    </details>
  );
}
