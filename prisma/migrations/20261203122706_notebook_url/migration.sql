-- AlterTable
ALTER TABLE "Workup" ADD COLUMN     "notebookUrl" TEXT NOT NULL DEFAULT '';
