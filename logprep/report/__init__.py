"""Reports: sheet pages, drawing helpers, writers."""
