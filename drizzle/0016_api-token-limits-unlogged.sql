-- Per-token request counts are short-lived (one-minute windows): they need no crash safety, and
-- writing them to the write-ahead log made every API request wait on a WAL flush while holding the
-- token's counter row. An unlogged table is emptied after a crash, which only restarts the windows.
ALTER TABLE "api_token_limits" SET UNLOGGED;
