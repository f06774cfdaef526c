"""Reports: sheet pages, drawing helpers, the field overview, writers."""
