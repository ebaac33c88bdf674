// Conductor data and line constants: NEC Chapter 9 Tables 8 and 9, NEC 310.16 ampacity, IEC 60228, Carson.
export * from './temperature';
export * from './nec-table8';
export * from './nec-table9';
export * from './ampacity';
export * from './iec-60228';
export * from './carson';
