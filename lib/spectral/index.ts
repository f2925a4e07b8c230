/**
 * Hairline's spectral engine: how the convergence rate Re λ2 of a directed consensus network
 * responds to each edge weight, and how much each weight may drift. Pure computation, no I/O.
 * See README.md in this folder for the mathematics.
 */
export * from './types';
export { SpectralInputError, SweepCancelledError } from './errors';
export { resolveOptions, DEFAULT_LADDER } from './options';
export { analyseBaseline } from './baseline';
export { auditEdge, auditNetwork, auditPerturbation, assembleAudit, type PerturbationAudit } from './sweep';
export { summariseNetwork } from './summary';
export { randomNetwork, seededUniform, jordanCoreNetwork, type RandomNetworkSpec, type JordanCoreSpec } from './random-network';
export { buildLaplacian, edgeSlots } from './laplacian';
export { classFromSlope, CLASS_EXPONENTS, CLASS_WINDOW } from './classify';
