-- API tokens expire: "expiresAt" is required. Tokens issued before get the default lifetime of
-- their time (90 days) counted from this migration. SQLite cannot add a required column without a
-- constant default, so the table is rebuilt (nothing refers to it).
CREATE TABLE "new_ApiToken" (
    "id" INTEGER NOT NULL PRIMARY KEY AUTOINCREMENT,
    "accountId" INTEGER NOT NULL,
    "name" TEXT NOT NULL,
    "tokenHash" TEXT NOT NULL,
    "prefix" TEXT NOT NULL,
    "createdAt" DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "expiresAt" DATETIME NOT NULL,
    "lastUsedAt" DATETIME,
    CONSTRAINT "ApiToken_accountId_fkey" FOREIGN KEY ("accountId") REFERENCES "Account" ("id") ON DELETE CASCADE ON UPDATE CASCADE
);
INSERT INTO "new_ApiToken" ("id", "accountId", "name", "tokenHash", "prefix", "createdAt", "expiresAt", "lastUsedAt")
SELECT "id", "accountId", "name", "tokenHash", "prefix", "createdAt", strftime('%Y-%m-%dT%H:%M:%f+00:00', 'now', '+90 days'), "lastUsedAt"
FROM "ApiToken";
DROP TABLE "ApiToken";
ALTER TABLE "new_ApiToken" RENAME TO "ApiToken";

-- CreateIndex
CREATE UNIQUE INDEX "ApiToken_tokenHash_key" ON "ApiToken"("tokenHash");

-- CreateIndex
CREATE INDEX "ApiToken_accountId_idx" ON "ApiToken"("accountId");
