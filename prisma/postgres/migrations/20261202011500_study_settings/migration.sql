-- AlterTable
ALTER TABLE "Study" ADD COLUMN "includeUpstream" BOOLEAN NOT NULL DEFAULT false,
ADD COLUMN "sensitivityRanges" TEXT NOT NULL DEFAULT '{}';
