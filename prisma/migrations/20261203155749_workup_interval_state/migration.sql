-- CreateEnum
CREATE TYPE "IntervalState" AS ENUM ('ready', 'pending', 'failed');

-- AlterTable
ALTER TABLE "Workup" ADD COLUMN     "intervalState" "IntervalState" NOT NULL DEFAULT 'ready';
