-- API tokens expire: "expiresAt" is required. Tokens issued before get the default lifetime of
-- their time (90 days) counted from this migration.
ALTER TABLE "ApiToken" ADD COLUMN "expiresAt" TIMESTAMP(3);
UPDATE "ApiToken" SET "expiresAt" = (now() AT TIME ZONE 'UTC') + INTERVAL '90 days';
ALTER TABLE "ApiToken" ALTER COLUMN "expiresAt" SET NOT NULL;
