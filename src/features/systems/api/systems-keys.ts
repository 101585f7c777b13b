// Systems themselves are an entity (src/entities/systems/); the refrigerant catalogue is read only here.
export const refrigerantKeys = {
  all: ["refrigerants"] as const,
};
