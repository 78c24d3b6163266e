// Integration tests run only against the test stack that `npm test` prepares; refusing
// anything else keeps them from touching the demo database of `npm start`.
if (process.env.STRUTWISE_PROFILE !== "test") {
  throw new Error("Integration tests need the test stack: run them with `npm test` (or `npm test -- integration`).");
}
export {};
