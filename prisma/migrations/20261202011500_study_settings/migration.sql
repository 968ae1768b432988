-- AlterTable
ALTER TABLE "Study" ADD COLUMN "includeUpstream" BOOLEAN NOT NULL DEFAULT false;
ALTER TABLE "Study" ADD COLUMN "sensitivityRanges" TEXT NOT NULL DEFAULT '{}';
