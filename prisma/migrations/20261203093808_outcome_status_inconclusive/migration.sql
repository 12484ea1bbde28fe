-- AlterEnum
ALTER TYPE "OutcomeStatus" ADD VALUE 'inconclusive';
