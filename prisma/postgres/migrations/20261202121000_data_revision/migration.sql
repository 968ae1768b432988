-- DataRevision: one counter that every committed change to any other table raises. A response
-- cached under one value of the counter is never served once it has moved (lib/services/response-cache.ts).
-- A new table needs its triggers here too (tests/db/data-revision.test.ts checks that every table has them).
-- PostgreSQL: the counter is raised at commit (a deferred constraint trigger), once per transaction,
-- after the transaction's own row locks are taken, so two writers never wait on each other in a cycle.
CREATE TABLE "DataRevision" (
    "id" INTEGER NOT NULL,
    "n" INTEGER NOT NULL DEFAULT 0,
    CONSTRAINT "DataRevision_pkey" PRIMARY KEY ("id")
);
INSERT INTO "DataRevision" ("id", "n") VALUES (1, 0);
CREATE FUNCTION stoke_raise_data_revision() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF current_setting('stoke.revision_raised_in', true) IS DISTINCT FROM txid_current()::text THEN
    PERFORM set_config('stoke.revision_raised_in', txid_current()::text, true);
    UPDATE "DataRevision" SET "n" = "n" + 1 WHERE "id" = 1;
  END IF;
  RETURN NULL;
END;
$$;
CREATE CONSTRAINT TRIGGER "Fuel_revision" AFTER INSERT OR UPDATE OR DELETE ON "Fuel" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "BlendComponent_revision" AFTER INSERT OR UPDATE OR DELETE ON "BlendComponent" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "PriceQuote_revision" AFTER INSERT OR UPDATE OR DELETE ON "PriceQuote" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "ExchangeRate_revision" AFTER INSERT OR UPDATE OR DELETE ON "ExchangeRate" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "Plant_revision" AFTER INSERT OR UPDATE OR DELETE ON "Plant" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "Study_revision" AFTER INSERT OR UPDATE OR DELETE ON "Study" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "UncertaintyRun_revision" AFTER INSERT OR UPDATE OR DELETE ON "UncertaintyRun" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "StudyRevision_revision" AFTER INSERT OR UPDATE OR DELETE ON "StudyRevision" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "RevisionQuote_revision" AFTER INSERT OR UPDATE OR DELETE ON "RevisionQuote" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "Scenario_revision" AFTER INSERT OR UPDATE OR DELETE ON "Scenario" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "Account_revision" AFTER INSERT OR UPDATE OR DELETE ON "Account" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "Session_revision" AFTER INSERT OR UPDATE OR DELETE ON "Session" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "ApiToken_revision" AFTER INSERT OR UPDATE OR DELETE ON "ApiToken" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "ChangeLog_revision" AFTER INSERT OR UPDATE OR DELETE ON "ChangeLog" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
CREATE CONSTRAINT TRIGGER "FlameSolve_revision" AFTER INSERT OR UPDATE OR DELETE ON "FlameSolve" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION stoke_raise_data_revision();
