-- AlterTable: quote versions, withdrawal, supplier
ALTER TABLE "PriceQuote" ADD COLUMN "supersedesId" INTEGER,
ADD COLUMN "withdrawnAt" TIMESTAMP(3),
ADD COLUMN "supplier" TEXT NOT NULL DEFAULT '';

-- AlterTable: the scenario's quote rule date
ALTER TABLE "Scenario" ADD COLUMN "priceValidOn" TIMESTAMP(3);

-- CreateTable
CREATE TABLE "ExchangeRate" (
    "id" SERIAL NOT NULL,
    "fromCurrency" TEXT NOT NULL,
    "toCurrency" TEXT NOT NULL,
    "rate" DOUBLE PRECISION NOT NULL,
    "validFrom" TIMESTAMP(3) NOT NULL,
    "source" TEXT NOT NULL DEFAULT '',
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "ExchangeRate_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "StudyRevision" (
    "id" SERIAL NOT NULL,
    "studyId" INTEGER NOT NULL,
    "number" INTEGER NOT NULL,
    "hash" TEXT NOT NULL,
    "inputs" TEXT NOT NULL,
    "results" TEXT NOT NULL,
    "meta" TEXT NOT NULL,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "StudyRevision_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "RevisionQuote" (
    "revisionId" INTEGER NOT NULL,
    "quoteId" INTEGER NOT NULL,

    CONSTRAINT "RevisionQuote_pkey" PRIMARY KEY ("revisionId","quoteId")
);

-- CreateIndex
CREATE INDEX "PriceQuote_supersedesId_idx" ON "PriceQuote"("supersedesId");

-- CreateIndex
CREATE UNIQUE INDEX "ExchangeRate_fromCurrency_toCurrency_validFrom_key" ON "ExchangeRate"("fromCurrency", "toCurrency", "validFrom");

-- CreateIndex
CREATE UNIQUE INDEX "StudyRevision_studyId_number_key" ON "StudyRevision"("studyId", "number");

-- CreateIndex
CREATE INDEX "RevisionQuote_quoteId_idx" ON "RevisionQuote"("quoteId");

-- AddForeignKey
ALTER TABLE "PriceQuote" ADD CONSTRAINT "PriceQuote_supersedesId_fkey" FOREIGN KEY ("supersedesId") REFERENCES "PriceQuote"("id") ON DELETE RESTRICT ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "StudyRevision" ADD CONSTRAINT "StudyRevision_studyId_fkey" FOREIGN KEY ("studyId") REFERENCES "Study"("id") ON DELETE RESTRICT ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "RevisionQuote" ADD CONSTRAINT "RevisionQuote_revisionId_fkey" FOREIGN KEY ("revisionId") REFERENCES "StudyRevision"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "RevisionQuote" ADD CONSTRAINT "RevisionQuote_quoteId_fkey" FOREIGN KEY ("quoteId") REFERENCES "PriceQuote"("id") ON DELETE RESTRICT ON UPDATE CASCADE;
