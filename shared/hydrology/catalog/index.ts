/**
 * Surface catalog defaults: published table rows with their sources, and the default Rillmark
 * surface classes seeded from them.
 */
export * from "./types";
export * from "./sheet-flow-n";
export * from "./velocity-k";
export * from "./curve-numbers";
export * from "./runoff-c";
export * from "./kerby-n";
export * from "./surface-classes";
export { FLOOR_30_NOTE } from "./cn-row";
