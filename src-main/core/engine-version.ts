/**
 * Bump whenever a change to the core can change a figure, a finding or a status. Stored
 * verdicts carry only statuses and list figures (the detail is evaluated afresh), so a store
 * opened by a newer engine re-checks every build once to keep the list and the sheets agreed.
 */
// 2: stored verdicts name the rule and source of the list's current (re-check fills them in).
// 3: safe-side model: parallel shares by conductance, unloaded tip speed, run current, geared
//    propellers, retired and repeated packs, incomplete above tight, plausibility bounds.
// 4: pack, supply and cell-count voltages exact to the millivolt (3 × 4.2 V no longer passes 12.6 V).
// 5: air density from field altitude and temperature; typical car and truck coefficients and
//    estimated propeller coefficients (verdicts on them no better than tight until confirmed);
//    run time, pack energy, hover, thrust-to-weight, motor heat, eRPM, lead wire and connector checks.
//    and pack logs: the newest logged resistance measurement sets a pack's sag; the pack-health rule.
//    and cells in series, motor Kv and pinion are figures a class limit can judge (a stored limit on
//    one read incomplete before).
// 6: a boat's propeller without coefficients gets them from the Wageningen B-series at the bollard
//    point (a boat known by diameter × pitch read incomplete before; now no better than tight).
//    and stored verdicts list the checks that are not clear, rule by rule, for the list's check filter
//    (rows written before hold none until re-checked).
//    and BEC current (a controller's BEC rating against the build's receiver and servo load, where a
//    load is entered; incomplete without the rating); motor heat judged against a rule of thumb per motor mass where the maker
//    rates no heat loss (no better than tight).
export const ENGINE_VERSION = 6;
