-- DropTable
DROP TABLE "Scenario";

