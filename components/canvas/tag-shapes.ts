// Value-tag outlines live beside the symbol geometry: the server's exports draw them too.
export * from '../../shared/symbols/tag-shapes';
