// Package tradeoff lays a scenario's options side by side: the cheapest
// plan, the fastest, a balanced pick between them, the most coverage a
// budget buys, the cheapest plan under each rate book offered; the
// cost–days frontier; the budget–coverage curve; what each rule costs; and
// how likely the chosen points are to miss a buried feature.
//
// Every figure comes from a re-solve of the plan model (package model) with
// the exact engine (package mip), never from a guess. Each solve runs to a
// stated relative gap and a node limit (not a time limit, so the same input
// gives the same output on any machine); the gap each solve reached is
// reported beside its figures. A generous time limit per solve is kept as
// a safety net only; a solve that reaches it says so in its status.
//
// # Methods
//
// Fastest plan: lexicographic — first the least finish T (model.Spec
// MinimizeDays), then the least cost with T ≤ that finish. Mobilizing
// another rig trades money for days: rigs work in parallel, and T is the
// longest rig's days.
//
// Cost–days frontier: the ε-constraint method (Y. Y. Haimes, L. S. Lasdon
// and D. A. Wismer, "On a bicriterion formulation of the problems of
// integrated system identification and system optimization", IEEE
// Transactions on Systems, Man, and Cybernetics 1(3):296–297, 1971;
// V. Chankong and Y. Y. Haimes, Multiobjective Decision Making: Theory and
// Methodology, North-Holland, 1983, ch. 4). The days objective becomes the
// bound T ≤ D and cost is minimized for each D from the fastest plan's
// finish to the cheapest plan's. Field days are whole, so every integer D
// in that range is a candidate; plans dominated by another (no fewer days
// and no less cost, one strictly worse) are removed.
//
// Balanced pick: the frontier point nearest, in Euclidean distance after
// scaling each objective to [0, 1] over the frontier, to the ideal point
// (least cost, fewest days) — the compromise-programming rule of Zeleny
// (Multiple Criteria Decision Making, McGraw-Hill, 1982 — from memory)
// with p = 2.
//
// Budget–coverage curve: the maximal covering form of the model (Church and
// ReVelle, 1974; see package model): the priority-weighted area within the
// covering radius of a chosen point, maximized under cost ≤ budget, for
// budgets from the cheapest minimal program (one point in every zone that
// has rules, plus the required points) to the cheapest plan that meets
// every rule. The knee is the point farthest from the chord between the
// curve's ends, both axes scaled to [0, 1] (the rule of Satopää et al.,
// "Finding a 'kneedle' in a haystack", ICDCS Workshops 2011 — from memory).
//
// What each rule costs: every rule of every zone is relaxed by one step
// (spacing +25 %, minimum points −1, minimum depth −10 %, sampled share
// −0.1) and dropped, the scenario is planned again, and the saving against
// the cheapest plan is reported beside the LP dual of the rule's row where
// the model has one (the count row of a zone prices one more point in the
// LP relaxation; the share row prices the share).
//
// Large sites (a model of localMinCols columns or more): a rule's
// relaxation is priced by re-planning its zone alone, the other zones kept
// as the cheapest plan has them, against the whole relaxed site's LP bound;
// a result within the analysis gap of that bound is the whole-site answer,
// any other is labelled localized and its saving is a least one (see
// localized). The maximal covering solves start from a lower budget's plan
// and stop at largeCoverNodeLimit nodes, stated in the curve.
//
// Chance of a miss: see HitProbability.
package tradeoff
