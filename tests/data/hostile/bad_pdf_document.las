%PDF-1.4
%ту╧╙
1 0 obj
