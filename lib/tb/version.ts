/**
 * Version of the numerical engine, stored with every fit record. Bump it whenever a change can move computed
 * energies or fitted values (solver, Hamiltonian, fit method); a re-run under another version says so.
 */
export const TB_ENGINE_VERSION = "1.1.0";
