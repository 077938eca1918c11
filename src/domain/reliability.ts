// Entry point kept at the path other modules import ("@/domain/reliability");
// the code lives in ./reliability/, split by method.
export * from "./reliability/index";
