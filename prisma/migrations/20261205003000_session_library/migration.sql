-- AlterTable
ALTER TABLE "Session" ADD COLUMN     "archivedAt" TIMESTAMPTZ(3),
ADD COLUMN     "tags" TEXT[] DEFAULT ARRAY[]::TEXT[];

-- CreateTable
CREATE TABLE "SavedScenario" (
    "id" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "keyHash" TEXT NOT NULL,
    "createdAt" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "SavedScenario_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "SavedScenarioVersion" (
    "scenarioId" TEXT NOT NULL,
    "version" INTEGER NOT NULL,
    "note" TEXT NOT NULL DEFAULT '',
    "body" JSONB NOT NULL,
    "createdAt" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "SavedScenarioVersion_pkey" PRIMARY KEY ("scenarioId","version")
);

-- CreateIndex
CREATE UNIQUE INDEX "SavedScenario_keyHash_key" ON "SavedScenario"("keyHash");

-- AddForeignKey
ALTER TABLE "SavedScenarioVersion" ADD CONSTRAINT "SavedScenarioVersion_scenarioId_fkey" FOREIGN KEY ("scenarioId") REFERENCES "SavedScenario"("id") ON DELETE CASCADE ON UPDATE CASCADE;

