export * from "./users";
export * from "./companies";
export * from "./mail";
export * from "./sessions";
export * from "./detectors";
export * from "./systems";
export * from "./plans";
export * from "./sweeps";
