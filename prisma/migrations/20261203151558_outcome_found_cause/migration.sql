-- AlterTable
ALTER TABLE "Outcome" ADD COLUMN     "foundCause" TEXT,
ADD COLUMN     "foundCauseAt" TIMESTAMP(3),
ADD COLUMN     "foundCauseById" TEXT,
ADD COLUMN     "foundCauseNote" TEXT NOT NULL DEFAULT '';
