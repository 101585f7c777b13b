// Systems themselves are an entity (src/entities/systems/); the refrigerant catalogue and the
// company's own refrigerants are read only here.
export const refrigerantKeys = {
  all: ["refrigerants"] as const,
};

export const companyRefrigerantKeys = {
  all: ["company-refrigerants"] as const,
};
