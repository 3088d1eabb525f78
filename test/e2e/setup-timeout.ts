// jest reads `testTimeout` only from the root configuration (it is a global option, so a project's own
// value is ignored): the browser tests set their longer limit here, for every test and hook.
jest.setTimeout(90_000);
