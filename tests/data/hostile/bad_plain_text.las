These are my notes on well 7.
