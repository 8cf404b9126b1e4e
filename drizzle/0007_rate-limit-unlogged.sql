-- Limit counts are short-lived and may be lost in a crash; an unlogged table writes no WAL, so a count costs no disk flush.
ALTER TABLE "rate_limit" SET UNLOGGED;
