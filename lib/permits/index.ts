// Permits to load and to strike. Each use case takes the route's context (the seam has checked
// who may call it); every state change goes through one transition helper (./transition.ts).
export { mayDecide, mayIssue } from "./authority";
export { closePermit, refusePermit, withdrawPermit } from "./decide";
export { delegateIssuing, revokeIssuing } from "./delegations";
export { permitDetail, permitJson, permitRecord, type PermitDetail, type PermitRecord } from "./detail";
export { issuePermit } from "./issue";
export { requestPermit } from "./request";
export { amendEvidence, confirmStruck } from "./strike";
