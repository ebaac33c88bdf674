// Voltage standards the results are judged against.
export * from './voltage-ranges';
