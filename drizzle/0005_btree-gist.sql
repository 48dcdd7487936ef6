-- Trusted extension (PostgreSQL 13+): GiST indexes that lead with a uuid column (layer_id).
CREATE EXTENSION IF NOT EXISTS btree_gist;
