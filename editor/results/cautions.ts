// The cautions shown wherever results are read (the solver's own text, so the drawing and the reports agree).
export { CAUTION } from '../../solver/results/derive';
