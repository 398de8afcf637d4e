// The cautions from the product brief, shown in the app, the print and the crew brief.
export const PLANNING_CAUTION = 'Passagewright is a planning aid. It is not type-approved navigation equipment and does not replace official charts, ENCs, sailing directions, notices to mariners, weather routing or the master\'s judgement.'
export const LAND_CHECK_CAUTION = 'Coastline data is coarse: a clear land check does not mean a safe track.'
export const RULES_CAUTION = 'Follow flag-state rules, company procedures and local regulations.'
export const ALL_CAUTIONS = [PLANNING_CAUTION, LAND_CHECK_CAUTION, RULES_CAUTION]
export const SEA_ROUTE_CAUTION = 'A suggested sea route knows the coarse coastline, the declared passages and your zones only: no depths, traffic separation schemes, weather, ice or notices. Check every leg on official charts before use.'
export const PASSAGE_LEG_CAUTION = 'A leg through a declared passage is held to the passage\'s fairway, not to the coastline: the passage\'s own rules, pilotage and official charts decide.'
