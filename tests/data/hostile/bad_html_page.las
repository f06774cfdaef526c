<!DOCTYPE html>
<html><body>~A</body></html>
