grammar Contour;
script : EOF ;
WS : [ \t\r\n]+ -> skip ;
