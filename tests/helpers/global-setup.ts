// Placeholder until the database harness lands: nothing to prepare for pure tests.
export default function setup() {}
