-- Measurements and the equipment register are corrected, never removed: a measurement once used
-- is superseded by a new one, and an item's changes are kept in its history. The application's
-- role may read, add and update them, but not delete or empty them.
REVOKE DELETE, TRUNCATE ON measurements, equipment FROM quietband_app;
