/** Who a connection is: the roles `hello` grants and `COMMAND_ROLES` gives commands to. */
export const ROLES = ["facilitator", "seat", "spectator", "guest"] as const;
export type Role = (typeof ROLES)[number];
