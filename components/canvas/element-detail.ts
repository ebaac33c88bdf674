// The size line under an element's name lives beside the symbol geometry: the server's exports draw it too.
export { elementDetail } from '../../shared/symbols/element-detail';
