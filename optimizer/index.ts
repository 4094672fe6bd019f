// The optimizer's only public face. Pure computation: no I/O, no project imports outside optimizer/.
// Each folder's README.md states its methods, references and tolerances; optimizer/README.md indexes them.
export * from './plant';
export * from './random';
export * from './fuel/index';
export * from './logs/index';
export * from './fit/index';
export * from './savings/index';
export * from './dispatch/index';
export * from './plan/index';
export { loadHighs } from './highs';
export * from './overhaul/index';
