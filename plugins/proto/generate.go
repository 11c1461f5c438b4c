// Package proto holds the protobuf wire contract between the rigmix host and
// its rig plugins (rig.proto) and the Go code generated from it. The
// generated files are committed so that a plain `go build` needs no protoc.
// Regenerate with `go generate ./plugins/proto` (protoc, protoc-gen-go and
// protoc-gen-go-grpc on PATH).
package proto

//go:generate protoc --go_out=. --go_opt=paths=source_relative --go-grpc_out=. --go-grpc_opt=paths=source_relative rig.proto
