This is a field report, not a log.
Depth, GR
100, 30
