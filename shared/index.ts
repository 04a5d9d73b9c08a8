// Public entry point of the shared calculation engine, used by the Angular app and the server.
export * from './calc/step';
export * from './calc/decimal-math';
export * from './units/length-unit';
export * from './angle/angle-text';
export * from './calc/taper';
export * from './calc/sine-bar';
export * from './calc/gauge-stack';
export * from './calc/stack-solver';
export * from './calc/angle-blocks';
export * from './calc/lathe-taper';
export * from './calc/over-pins';
export * from './data/gauge-sets';
export * from './data/gauge-tolerances';
export * from './data/angle-block-sets';
export * from './data/machine-tapers';
export * from './api/calc';
