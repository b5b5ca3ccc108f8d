// The shapes are shared with the server (backend/src/contracts/spectra.ts); the comb's line types live in lib.
export * from '@contracts/spectra';
export type { CombLine, LineKind } from '@/lib/line-list';
