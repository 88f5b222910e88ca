// Physical constants shared by every Cp model. One definition, imported everywhere.

/**
 * Molar gas constant, J/(mol K): the CODATA 2018 recommended value as published to ten significant
 * digits. Since the 2019 SI redefinition R = N_A·k is exact (6.02214076e23 × 1.380649e-23 =
 * 8.31446261815324…); the ten-digit value differs from it by 2e-11 relative, far below anything a
 * property table resolves.
 */
export const R_J_PER_MOL_K = 8.314462618;

/** The reference temperature of standard formation properties, K. */
export const T_REF_K = 298.15;
