// The findings the equilibrium stage raises. They follow the rule shape of pipeline/rules/ (id,
// severity, docs, message templates) but are raised while reactions are read and computed, not per
// species, so none of them has a `check` function. Documented in docs/equilibrium.md.
import type { Rule } from '../types.js';

const DOCS = 'docs/equilibrium.md';

/** A row of the reactions file that cannot be used: no id, no equation, bad temperatures, bad syntax. */
export const reactionRow: Rule = {
  id: 'reaction-row',
  severity: 'error',
  docs: `${DOCS}#reaction-row`,
  description: 'A reactions-file row must give an id, an equation that can be read, and usable temperatures.',
  messages: {
    'missing-id': 'the reaction has no id',
    'missing-equation': 'reaction {id} has no equation',
    'duplicate-id': 'reaction id {id} is used again (first on line {firstLine}); this row is skipped',
    'bad-temperature': 'reaction {id}: temperature "{text}" is not a number above 0 K',
    'bad-window': 'reaction {id}: Tmin {Tmin} K is above Tmax {Tmax} K',
    'half-window': 'reaction {id}: give both Tmin and Tmax, or a list of temperatures in T',
    syntax: 'reaction {id}: {detail}',
  },
};

/** A species named in an equation that the table does not hold, or holds more than once. */
export const reactionSpecies: Rule = {
  id: 'reaction-species',
  severity: 'error',
  docs: `${DOCS}#reaction-species`,
  description: 'Every species in an equation must name exactly one species of the table (by name or formula, and phase).',
  messages: {
    unknown: 'reaction {id}: no species "{term}" in the table{hint}',
    ambiguous: 'reaction {id}: "{term}" matches {count} species ({candidates}); write the phase or the species name',
  },
};

/** Elements or charge that do not balance. */
export const reactionUnbalanced: Rule = {
  id: 'reaction-unbalanced',
  severity: 'error',
  docs: `${DOCS}#reaction-unbalanced`,
  description: 'A reaction must conserve every element and the charge; an unbalanced reaction gets no ln K.',
  messages: {
    elements: 'reaction {id} does not balance: {residual} (products minus reactants); no ln K is computed',
    charge: 'reaction {id} does not balance its charge: {charge} (products minus reactants); no ln K is computed',
    empty: 'reaction {id}: every species cancels between the two sides; there is nothing to compute',
  },
};

/** Formation data or Cp data a reaction needs and a species lacks. */
export const reactionData: Rule = {
  id: 'reaction-data',
  severity: 'error',
  docs: `${DOCS}#reaction-data`,
  description: 'Each species of a reaction needs two of ΔfH°, ΔfG°, S° (the third follows), and a Cp correlation for the rigorous route.',
  messages: {
    incomplete: 'reaction {id}: {species} has {have}; two of ΔfH°, ΔfG°, S° are needed, so no ln K is computed',
    'no-element-entropy': 'reaction {id}: {species} gives no S° and the element entropies of its formula are unknown, so S° cannot be derived from ΔfG°; no ln K is computed',
    'cp-missing': 'reaction {id}: {species} has no usable Cp correlation; ln K is computed with ΔrCp = 0 (constant ΔrH° and ΔrS°) at every temperature',
  },
};

/** A species' Cp correlation evaluated outside the range it was fitted on, at a reaction's temperatures. */
export const reactionExtrapolation: Rule = {
  id: 'reaction-extrapolation',
  severity: 'warning',
  docs: `${DOCS}#reaction-extrapolation`,
  description: "A reaction's temperatures should lie inside every participating species' Cp range.",
  messages: {
    outside:
      'reaction {id}: the Cp of {species} (fitted {Tmin}–{Tmax} K) is extrapolated at {temps} K, up to {outsideK} K beyond its range (Cp there {cp} J/(mol K))',
    'reference-outside':
      'reaction {id}: the Cp of {species} (fitted {Tmin}–{Tmax} K) does not reach 298.15 K, so its H and S integrals from 298.15 K run {outsideK} K through the extrapolated correlation at every temperature',
  },
};

export const EQUILIBRIUM_RULES: readonly Rule[] = [reactionRow, reactionSpecies, reactionUnbalanced, reactionData, reactionExtrapolation];
