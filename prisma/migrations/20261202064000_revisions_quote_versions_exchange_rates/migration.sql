-- AlterTable: quote versions, withdrawal, supplier
ALTER TABLE "PriceQuote" ADD COLUMN "supersedesId" INTEGER REFERENCES "PriceQuote" ("id") ON DELETE RESTRICT ON UPDATE CASCADE;
ALTER TABLE "PriceQuote" ADD COLUMN "withdrawnAt" DATETIME;
ALTER TABLE "PriceQuote" ADD COLUMN "supplier" TEXT NOT NULL DEFAULT '';

-- AlterTable: the scenario's quote rule date
ALTER TABLE "Scenario" ADD COLUMN "priceValidOn" DATETIME;

-- CreateTable
CREATE TABLE "ExchangeRate" (
    "id" INTEGER NOT NULL PRIMARY KEY AUTOINCREMENT,
    "fromCurrency" TEXT NOT NULL,
    "toCurrency" TEXT NOT NULL,
    "rate" REAL NOT NULL,
    "validFrom" DATETIME NOT NULL,
    "source" TEXT NOT NULL DEFAULT '',
    "createdAt" DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP
);

-- CreateTable
CREATE TABLE "StudyRevision" (
    "id" INTEGER NOT NULL PRIMARY KEY AUTOINCREMENT,
    "studyId" INTEGER NOT NULL,
    "number" INTEGER NOT NULL,
    "hash" TEXT NOT NULL,
    "inputs" TEXT NOT NULL,
    "results" TEXT NOT NULL,
    "meta" TEXT NOT NULL,
    "createdAt" DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
    CONSTRAINT "StudyRevision_studyId_fkey" FOREIGN KEY ("studyId") REFERENCES "Study" ("id") ON DELETE RESTRICT ON UPDATE CASCADE
);

-- CreateTable
CREATE TABLE "RevisionQuote" (
    "revisionId" INTEGER NOT NULL,
    "quoteId" INTEGER NOT NULL,

    PRIMARY KEY ("revisionId", "quoteId"),
    CONSTRAINT "RevisionQuote_revisionId_fkey" FOREIGN KEY ("revisionId") REFERENCES "StudyRevision" ("id") ON DELETE CASCADE ON UPDATE CASCADE,
    CONSTRAINT "RevisionQuote_quoteId_fkey" FOREIGN KEY ("quoteId") REFERENCES "PriceQuote" ("id") ON DELETE RESTRICT ON UPDATE CASCADE
);

-- CreateIndex
CREATE INDEX "PriceQuote_supersedesId_idx" ON "PriceQuote"("supersedesId");

-- CreateIndex
CREATE UNIQUE INDEX "ExchangeRate_fromCurrency_toCurrency_validFrom_key" ON "ExchangeRate"("fromCurrency", "toCurrency", "validFrom");

-- CreateIndex
CREATE UNIQUE INDEX "StudyRevision_studyId_number_key" ON "StudyRevision"("studyId", "number");

-- CreateIndex
CREATE INDEX "RevisionQuote_quoteId_idx" ON "RevisionQuote"("quoteId");
