-- DataRevision: one counter that every committed change to any other table raises. A response
-- cached under one value of the counter is never served once it has moved (lib/services/response-cache.ts).
-- A new table needs its triggers here too (tests/db/data-revision.test.ts checks that every table has them).
CREATE TABLE "DataRevision" (
    "id" INTEGER NOT NULL PRIMARY KEY,
    "n" INTEGER NOT NULL DEFAULT 0
);
INSERT INTO "DataRevision" ("id", "n") VALUES (1, 0);
CREATE TRIGGER "Fuel_revision_insert" AFTER INSERT ON "Fuel" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Fuel_revision_update" AFTER UPDATE ON "Fuel" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Fuel_revision_delete" AFTER DELETE ON "Fuel" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "BlendComponent_revision_insert" AFTER INSERT ON "BlendComponent" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "BlendComponent_revision_update" AFTER UPDATE ON "BlendComponent" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "BlendComponent_revision_delete" AFTER DELETE ON "BlendComponent" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "PriceQuote_revision_insert" AFTER INSERT ON "PriceQuote" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "PriceQuote_revision_update" AFTER UPDATE ON "PriceQuote" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "PriceQuote_revision_delete" AFTER DELETE ON "PriceQuote" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "ExchangeRate_revision_insert" AFTER INSERT ON "ExchangeRate" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "ExchangeRate_revision_update" AFTER UPDATE ON "ExchangeRate" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "ExchangeRate_revision_delete" AFTER DELETE ON "ExchangeRate" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Plant_revision_insert" AFTER INSERT ON "Plant" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Plant_revision_update" AFTER UPDATE ON "Plant" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Plant_revision_delete" AFTER DELETE ON "Plant" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Study_revision_insert" AFTER INSERT ON "Study" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Study_revision_update" AFTER UPDATE ON "Study" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Study_revision_delete" AFTER DELETE ON "Study" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "UncertaintyRun_revision_insert" AFTER INSERT ON "UncertaintyRun" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "UncertaintyRun_revision_update" AFTER UPDATE ON "UncertaintyRun" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "UncertaintyRun_revision_delete" AFTER DELETE ON "UncertaintyRun" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "StudyRevision_revision_insert" AFTER INSERT ON "StudyRevision" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "StudyRevision_revision_update" AFTER UPDATE ON "StudyRevision" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "StudyRevision_revision_delete" AFTER DELETE ON "StudyRevision" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "RevisionQuote_revision_insert" AFTER INSERT ON "RevisionQuote" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "RevisionQuote_revision_update" AFTER UPDATE ON "RevisionQuote" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "RevisionQuote_revision_delete" AFTER DELETE ON "RevisionQuote" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Scenario_revision_insert" AFTER INSERT ON "Scenario" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Scenario_revision_update" AFTER UPDATE ON "Scenario" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Scenario_revision_delete" AFTER DELETE ON "Scenario" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Account_revision_insert" AFTER INSERT ON "Account" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Account_revision_update" AFTER UPDATE ON "Account" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Account_revision_delete" AFTER DELETE ON "Account" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Session_revision_insert" AFTER INSERT ON "Session" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Session_revision_update" AFTER UPDATE ON "Session" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "Session_revision_delete" AFTER DELETE ON "Session" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "ApiToken_revision_insert" AFTER INSERT ON "ApiToken" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "ApiToken_revision_update" AFTER UPDATE ON "ApiToken" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "ApiToken_revision_delete" AFTER DELETE ON "ApiToken" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "ChangeLog_revision_insert" AFTER INSERT ON "ChangeLog" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "ChangeLog_revision_update" AFTER UPDATE ON "ChangeLog" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "ChangeLog_revision_delete" AFTER DELETE ON "ChangeLog" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "FlameSolve_revision_insert" AFTER INSERT ON "FlameSolve" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "FlameSolve_revision_update" AFTER UPDATE ON "FlameSolve" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
CREATE TRIGGER "FlameSolve_revision_delete" AFTER DELETE ON "FlameSolve" BEGIN UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1; END;
