module plumb

go 1.26.8

require github.com/ajstarks/svgo v0.0.0-20211024235047-1546f124cd8b
