export * from "./constants";
export * from "./schools";
export * from "./users";
export * from "./classes";
export * from "./invitations";
export * from "./audit-log";
export * from "./mail-messages";
export * from "./practicals";
