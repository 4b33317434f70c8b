-- CreateTable
-- Per-address abuse budgets shared by every server process on one PostgreSQL (the server's
-- abuse.ts, rate-limiter-flexible's PostgreSQL store: key "<budget>:<address>", points used,
-- expire in epoch ms). The embedded database gets the table too and leaves it empty.
CREATE TABLE "RateLimit" (
    "key" VARCHAR(255) NOT NULL,
    "points" INTEGER NOT NULL DEFAULT 0,
    "expire" BIGINT,

    CONSTRAINT "RateLimit_pkey" PRIMARY KEY ("key")
);
