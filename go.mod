module plumb

go 1.26.0

require (
	github.com/ajstarks/svgo v0.0.0-20211024235047-1546f124cd8b
	github.com/lucasb-eyer/go-colorful v1.4.1
	github.com/paulmach/orb v0.14.0
	github.com/stretchr/testify v1.12.1
	golang.org/x/image v0.48.0
	gonum.org/v1/gonum v0.17.0
)

require (
	go.mongodb.org/mongo-driver/v2 v2.5.0 // indirect
	go.yaml.in/yaml/v3 v3.0.5 // indirect
	golang.org/x/sys v0.50.0 // indirect
	golang.org/x/text v0.44.0 // indirect
)
